// Bookmarks and notes on manual pages, as the reader receives them.
import type { MarkKind } from "@/lib/domain/validation/library";

export interface PageMarkDto {
  id: string;
  kind: MarkKind;
  text: string;
  /** Who wrote it and whether it is the asker's own (only their own can be removed). */
  authorName: string;
  mine: boolean;
  /** The class a note is shown to; null for the writer's own. */
  className: string | null;
  /** Where it was made. */
  made: { revisionId: string; revisionLabel: string; page: number };
  /**
   * Where it is in the revision asked about, through the page comparisons: the same page, moved,
   * changed since, or removed (page null). null when the comparisons do not reach (a mark made on
   * a later revision than the one being read).
   */
  here: { page: number | null; status: "unchanged" | "moved" | "changed" | "removed" } | null;
  createdAt: string;
}
