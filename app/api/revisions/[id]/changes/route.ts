import { requireApiUser } from "@/lib/auth/session";
import { idParam, route } from "@/lib/http";
import { getReadableRevision } from "@/lib/library/manuals";
import { getComparison } from "@/lib/revisions/rechecks";

type Context = { params: Promise<{ id: string }> };

/** The page-by-page comparison of a revision with the one before it. */
export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("library:view");
  const revisionId = idParam((await params).id, "That revision");
  await getReadableRevision({ actor, id: revisionId });
  const { previousRevisionId, pages, summary } = await getComparison({ revisionId });
  return Response.json({ previousRevisionId, pages, summary });
});
