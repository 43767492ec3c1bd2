import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getCardVersion } from "@/lib/server/cards/read";
import { updateVersion } from "@/lib/server/cards/draft";

export const GET = handle(api.cards.getVersion, async ({ actor, params: { id, v } }) => ({
  version: await getCardVersion({ actor, cardId: id, number: v }),
}));

/** Changes a draft version; a published one answers 409 and stays as it was. */
export const PATCH = handle(api.cards.updateVersion, async ({ actor, params: { id, v }, body: { content, editCount } }) => ({
  version: await updateVersion({ actor, cardId: id, number: v, content, editCount }),
}));
