import { createUser, listUsers } from "@/lib/accounts";
import { requireApiUser } from "@/lib/auth/session";
import { toAccountDto } from "@/lib/dto";
import { readJson, route } from "@/lib/http";
import { createAccountSchema } from "@/lib/validation/accounts";

export const GET = route(async () => {
  await requireApiUser("accounts:manage");
  return Response.json({ users: (await listUsers()).map(toAccountDto) });
});

export const POST = route(async (request) => {
  const actor = await requireApiUser("accounts:manage");
  const input = await readJson(request, createAccountSchema);
  const user = await createUser({ actor, actorName: actor.name, input: { ...input, password: input.password || undefined } });
  return Response.json({ user: toAccountDto(user) }, { status: 201 });
});
