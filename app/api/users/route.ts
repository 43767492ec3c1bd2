import { handle } from "@/app/_adapters/handle";
import { toAccountDto } from "@/lib/contracts/accounts";
import { api } from "@/lib/contracts/endpoints";
import { createUser, listUsers } from "@/lib/server/accounts";

export const GET = handle(api.accounts.list, async () => ({ users: (await listUsers()).map(toAccountDto) }));

export const POST = handle(api.accounts.create, async ({ actor, body }) => {
  const user = await createUser({ actor, actorName: actor.name, input: { ...body, password: body.password || undefined } });
  return { user: toAccountDto(user) };
});
