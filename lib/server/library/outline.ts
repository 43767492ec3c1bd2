// The contents of a revision for the reader's side panel, from the first line of each page.
import "server-only";
import { asc, eq } from "drizzle-orm";
import { getDb } from "@/db";
import { pages } from "@/db/schema";
import { outlineFromHeadings, type OutlineChapter } from "@/lib/domain/library/outline";

/** One small read (a heading per page) per opening of the reader; a 900-page manual is ~40 kB of headings. */
export async function revisionOutline(revisionId: string): Promise<OutlineChapter[]> {
  const rows = await getDb()
    .select({ page: pages.pageNumber, heading: pages.heading })
    .from(pages)
    .where(eq(pages.revisionId, revisionId))
    .orderBy(asc(pages.pageNumber));
  return outlineFromHeadings(rows);
}
