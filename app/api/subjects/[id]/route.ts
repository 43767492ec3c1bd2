import { requireApiUser } from "@/app/_adapters/session";
import { renameSubject } from "@/lib/server/cards/subjects";
import { idParam, readJson, route } from "@/lib/server/http";
import { subjectSchema } from "@/lib/domain/validation/cards";

type Context = { params: Promise<{ id: string }> };

export const PATCH = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("subjects:manage");
  const id = idParam((await params).id, "That subject");
  const { name } = await readJson(request, subjectSchema);
  return Response.json({ subject: await renameSubject({ actor, id, name }) });
});
