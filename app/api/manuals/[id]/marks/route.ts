import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { listMarks } from "@/lib/server/library/marks";

export const GET = handle(api.library.listMarks, async ({ actor, params: { id }, query }) => ({
  marks: await listMarks({ actor, manualId: id, revisionId: query.revision }),
}));
