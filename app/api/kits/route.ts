import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createKit, listKits } from "@/lib/server/tools/catalogue";

export const GET = handle(api.tools.listKits, async () => ({ kits: await listKits() }));
export const POST = handle(api.tools.createKit, async ({ actor, body }) => ({ kit: await createKit({ actor, input: body }) }));
