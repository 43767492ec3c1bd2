import { handle } from "@/app/_adapters/handle";
import { toAccountDto } from "@/lib/contracts/accounts";
import { api } from "@/lib/contracts/endpoints";
import { getUserById, updateUser } from "@/lib/server/accounts";

export const GET = handle(api.accounts.get, async ({ params: { id } }) => ({ user: toAccountDto(await getUserById({ id })) }));

export const PATCH = handle(api.accounts.update, async ({ actor, params: { id }, body }) => ({
  user: toAccountDto(await updateUser({ actor, id, changes: body })),
}));
