import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getAssignment, updateAssignment } from "@/lib/server/runs/assign";

export const GET = handle(api.runs.getAssignment, async ({ actor, params: { id } }) => ({
  assignment: await getAssignment({ actor, id }),
}));

export const PATCH = handle(api.runs.updateAssignment, async ({ actor, params: { id }, body }) => ({
  assignment: await updateAssignment({ actor, id, dueOn: body.dueOn, note: body.note }),
}));
