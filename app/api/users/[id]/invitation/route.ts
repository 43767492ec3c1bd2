import { resendInvitation } from "@/lib/accounts";
import { requireApiUser } from "@/lib/auth/session";
import { toAccountDto } from "@/lib/dto";
import { idParam, route } from "@/lib/http";

type Context = { params: Promise<{ id: string }> };

/** Sends a new invitation link; the older one stops working. */
export const POST = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("accounts:manage");
  const id = idParam((await params).id, "That account");
  const user = await resendInvitation({ actor, actorName: actor.name, id });
  return Response.json({ user: toAccountDto(user) }, { status: 202 });
});
