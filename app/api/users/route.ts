import { createUser, listUsers } from "@/lib/server/accounts";
import { requireApiUser } from "@/app/_adapters/session";
import { toAccountDto } from "@/lib/contracts/accounts";
import { readJson, route } from "@/lib/server/http";
import { createAccountSchema } from "@/lib/domain/validation/accounts";

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
