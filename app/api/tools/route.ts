import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createTool, listTools } from "@/lib/server/tools/catalogue";

export const GET = handle(api.tools.listTools, async ({ query }) => ({ tools: await listTools({ dueWithin: query.dueWithin }) }));
export const POST = handle(api.tools.createTool, async ({ actor, body }) => ({ tool: await createTool({ actor, input: body }) }));
