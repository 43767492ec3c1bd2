import { requireApiUser } from "@/app/_adapters/session";
import { createSubject, listSubjects } from "@/lib/server/cards/subjects";
import { readJson, route } from "@/lib/server/http";
import { subjectSchema } from "@/lib/domain/validation/cards";

export const GET = route(async () => {
  await requireApiUser("cards:view");
  return Response.json({ subjects: await listSubjects() });
});

export const POST = route(async (request) => {
  const actor = await requireApiUser("subjects:manage");
  const { name } = await readJson(request, subjectSchema);
  return Response.json({ subject: await createSubject({ actor, name }) }, { status: 201 });
});
