import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getRevision } from "@/lib/server/library/manuals";

export const GET = handle(api.library.getRevision, async ({ params: { id } }) => {
  const r = await getRevision({ id });
  return {
    id: r.id,
    manualId: r.manualId,
    label: r.label,
    date: r.revisionDate,
    status: r.status,
    pagesDone: r.pagesDone,
    pageCount: r.pageCount,
    error: r.error,
    current: r.currentRevisionId === r.id,
    supersededAt: r.supersededAt?.toISOString() ?? null,
  };
});
