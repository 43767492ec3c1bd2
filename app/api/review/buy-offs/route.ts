import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { listBuyOffCalls } from "@/lib/server/runs/buy-offs";

export const GET = handle(api.runs.buyOffQueue, async ({ actor }) => ({ points: await listBuyOffCalls({ actor }) }));
