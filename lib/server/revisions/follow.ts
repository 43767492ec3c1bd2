// Reading the chain of page comparisons from one revision of a manual to a later one.
import "server-only";
import { eq, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { revisionComparisons, revisions } from "@/db/schema";
import type { PageChange } from "@/lib/domain/revisions/compare";
import { followPage, type FollowedPage } from "@/lib/domain/revisions/follow";

/**
 * The comparisons leading from `fromRevisionId` to `toRevisionId`, oldest first; null when the
 * later revision is not reached through them (a comparison missing, another manual).
 */
export async function comparisonChain(fromRevisionId: string, toRevisionId: string): Promise<PageChange[][] | null> {
  if (fromRevisionId === toRevisionId) return [];
  // A manual has a handful of revisions: all their comparisons are read at once, then walked.
  const rows = await getDb()
    .select({
      revisionId: revisionComparisons.revisionId,
      previous: revisionComparisons.previousRevisionId,
      pages: revisionComparisons.pages,
    })
    .from(revisionComparisons)
    .innerJoin(revisions, eq(revisions.id, revisionComparisons.revisionId))
    .where(sql`${revisions.manualId} = (select manual_id from revisions where id = ${fromRevisionId})`);
  const chain: PageChange[][] = [];
  let at = fromRevisionId;
  for (let steps = 0; steps < rows.length && at !== toRevisionId; steps++) {
    const next = rows.find((r) => r.previous === at);
    if (!next) return null;
    chain.push(next.pages as PageChange[]);
    at = next.revisionId;
  }
  return at === toRevisionId ? chain : null;
}

/** Where the content of `page` of one revision is in a later one; null when it cannot be told. */
export async function pageInRevision(fromRevisionId: string, page: number, toRevisionId: string): Promise<FollowedPage | null> {
  const chain = await comparisonChain(fromRevisionId, toRevisionId);
  return chain ? followPage(chain, page) : null;
}
