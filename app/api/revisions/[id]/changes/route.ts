import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getReadableRevision } from "@/lib/server/library/manuals";
import { getComparison } from "@/lib/server/revisions/rechecks";

/** The page-by-page comparison of a revision with the one before it. */
export const GET = handle(api.library.changes, async ({ actor, params: { id } }) => {
  await getReadableRevision({ actor, id });
  return getComparison({ revisionId: id });
});
