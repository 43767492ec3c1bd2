import { requireApiUser } from "@/lib/auth/session";
import { createSubject, listSubjects } from "@/lib/cards";
import { readJson, route } from "@/lib/http";
import { subjectSchema } from "@/lib/validation/cards";

export const GET = route(async () => {
  await requireApiUser("cards:view");
  return Response.json({ subjects: await listSubjects() });
});

export const POST = route(async (request) => {
  const actor = await requireApiUser("subjects:manage");
  const { name } = await readJson(request, subjectSchema);
  return Response.json({ subject: await createSubject({ actor, name }) }, { status: 201 });
});
