import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { listReviewQueue } from "@/lib/server/runs/queries";

export const GET = handle(api.runs.reviewQueue, async ({ actor, query: { status } }) => ({
  runs: await listReviewQueue({ actor, status }),
}));
