import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { withdrawAssignment } from "@/lib/server/runs/assign";

export const POST = handle(api.runs.withdrawAssignment, async ({ actor, params: { id }, body: { reason } }) => ({
  assignment: await withdrawAssignment({ actor, id, reason }),
}));
