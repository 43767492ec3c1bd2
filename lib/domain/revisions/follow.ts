// Where a page of an older revision is in a later one, through the page comparisons between
// revisions (lib/domain/revisions/compare.ts): the superseded banner, bookmarks and notes follow
// the content, not the page number.
import type { PageChange, PageStatus } from "@/lib/domain/revisions/compare";

export interface FollowedPage {
  /** The page in the last revision of the chain; null when the content went. */
  page: number | null;
  /** "unchanged" only if it stayed the same in every step; "changed" once its text changed anywhere on the way. */
  status: Exclude<PageStatus, "added">;
}

/**
 * Follows `page` through `chain`, each the comparison of a revision with the one before it, oldest
 * first. A step with no entry for the page (a comparison that could not be made) keeps the number
 * and counts as changed, so nothing claims "unchanged" without having looked.
 */
export function followPage(chain: readonly (readonly PageChange[])[], page: number): FollowedPage {
  let at: number | null = page;
  let status: FollowedPage["status"] = "unchanged";
  for (const pages of chain) {
    if (at === null) break;
    const entry = pages.find((p) => p.oldPage === at);
    if (!entry) {
      status = "changed";
      continue;
    }
    if (entry.status === "removed" || entry.newPage === null) return { page: null, status: "removed" };
    if (entry.status === "changed") status = "changed";
    else if (entry.status === "moved" && status === "unchanged") status = "moved";
    at = entry.newPage;
  }
  return { page: at, status };
}
