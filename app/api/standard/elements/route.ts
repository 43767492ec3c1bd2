import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { listElements } from "@/lib/server/standard";

export const GET = handle(api.standard.listElements, async ({ query }) => listElements({ q: query.q, kind: query.kind }));
