import { getUserById, updateUser } from "@/lib/server/accounts";
import { requireApiUser } from "@/app/_adapters/session";
import { toAccountDto } from "@/lib/contracts/accounts";
import { idParam, readJson, route } from "@/lib/server/http";
import { updateAccountSchema } from "@/lib/domain/validation/accounts";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  await requireApiUser("accounts:manage");
  const id = idParam((await params).id, "That account");
  return Response.json({ user: toAccountDto(await getUserById({ id })) });
});

export const PATCH = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("accounts:manage");
  const id = idParam((await params).id, "That account");
  const changes = await readJson(request, updateAccountSchema);
  return Response.json({ user: toAccountDto(await updateUser({ actor, id, changes })) });
});
