import { requireApiUser } from "@/app/_adapters/session";
import { isUuid, readJson, route } from "@/lib/server/http";
import { createAssignment, listAssignments } from "@/lib/server/runs/assign";
import { createAssignmentSchema } from "@/lib/domain/validation/runs";

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
