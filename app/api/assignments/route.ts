import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createAssignment, listAssignments } from "@/lib/server/runs/assign";

export const GET = handle(api.runs.listAssignments, async ({ actor, query }) => ({
  assignments: await listAssignments({ actor, cardId: query.card }),
}));

export const POST = handle(api.runs.createAssignment, async ({ actor, body }) => ({
  assignment: await createAssignment({ actor, input: body }),
}));
