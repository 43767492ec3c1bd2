import { requireApiUser } from "@/app/_adapters/session";
import { idParam, route } from "@/lib/server/http";
import { retryRevision } from "@/lib/server/library/manuals";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("library:manage");
  const { id } = await retryRevision({ actor, id: idParam((await params).id, "That revision") });
  return Response.json({ revisionId: id, status: "queued" }, { status: 202 });
});
