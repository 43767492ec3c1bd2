import { handle } from "@/app/_adapters/handle";
import { toAccountDto } from "@/lib/contracts/accounts";
import { api } from "@/lib/contracts/endpoints";
import { resendInvitation } from "@/lib/server/accounts";

/** Sends a new invitation link; the older one stops working. */
export const POST = handle(api.accounts.resendInvitation, async ({ actor, params: { id } }) => ({
  user: toAccountDto(await resendInvitation({ actor, actorName: actor.name, id })),
}));
