import { resendInvitation } from "@/lib/server/accounts";
import { requireApiUser } from "@/app/_adapters/session";
import { toAccountDto } from "@/lib/contracts/accounts";
import { idParam, route } from "@/lib/server/http";

type Context = { params: Promise<{ id: string }> };

/** Sends a new invitation link; the older one stops working. */
export const POST = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("accounts:manage");
  const id = idParam((await params).id, "That account");
  const user = await resendInvitation({ actor, actorName: actor.name, id });
  return Response.json({ user: toAccountDto(user) }, { status: 202 });
});
