import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getTool, updateTool } from "@/lib/server/tools/catalogue";

export const GET = handle(api.tools.getTool, async ({ params: { id } }) => ({ tool: await getTool(id) }));
export const PATCH = handle(api.tools.updateTool, async ({ actor, params: { id }, body }) => ({
  tool: await updateTool({ actor, id, input: body }),
}));
