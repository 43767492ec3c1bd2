import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { setCoauthors } from "@/lib/server/cards/access";

/** The owner (or an admin) names who may edit the card beside them; the list replaces the old one. */
export const PUT = handle(api.cards.setCoauthors, async ({ actor, params: { id }, body: { userIds } }) => ({
  coauthors: await setCoauthors({ actor, cardId: id, userIds }),
}));
