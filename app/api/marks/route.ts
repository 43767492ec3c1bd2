import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { addMark } from "@/lib/server/library/marks";

export const POST = handle(api.library.createMark, async ({ actor, body }) => ({ mark: await addMark({ actor, input: body }) }));
