import { requireApiUser } from "@/app/_adapters/session";
import { idParam, route } from "@/lib/server/http";
import { getReadableRevision } from "@/lib/server/library/manuals";
import { getComparison } from "@/lib/server/revisions/rechecks";

type Context = { params: Promise<{ id: string }> };

/** The page-by-page comparison of a revision with the one before it. */
export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("library:view");
  const revisionId = idParam((await params).id, "That revision");
  await getReadableRevision({ actor, id: revisionId });
  const { previousRevisionId, pages, summary } = await getComparison({ revisionId });
  return Response.json({ previousRevisionId, pages, summary });
});
