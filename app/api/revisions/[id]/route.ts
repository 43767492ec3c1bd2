import { requireApiUser } from "@/app/_adapters/session";
import { idParam, route } from "@/lib/server/http";
import { getRevision } from "@/lib/server/library/manuals";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  await requireApiUser("library:view");
  const r = await getRevision({ id: idParam((await params).id, "That revision") });
  return Response.json({
    id: r.id,
    manualId: r.manualId,
    label: r.label,
    date: r.revisionDate,
    status: r.status,
    pagesDone: r.pagesDone,
    pageCount: r.pageCount,
    error: r.error,
    current: r.currentRevisionId === r.id,
    supersededAt: r.supersededAt,
  });
});
