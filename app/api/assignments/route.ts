import { requireApiUser } from "@/lib/auth/session";
import { isUuid, readJson, route } from "@/lib/http";
import { createAssignment, listAssignments } from "@/lib/runs/runs";
import { createAssignmentSchema } from "@/lib/validation/runs";

export const GET = route(async (request) => {
  const actor = await requireApiUser("assignments:manage");
  const card = new URL(request.url).searchParams.get("card") ?? "";
  return Response.json({ assignments: await listAssignments({ actor, cardId: isUuid(card) ? card : undefined }) });
});

export const POST = route(async (request) => {
  const actor = await requireApiUser("assignments:manage");
  const input = await readJson(request, createAssignmentSchema);
  return Response.json({ assignment: await createAssignment({ actor, input }) }, { status: 201 });
});
