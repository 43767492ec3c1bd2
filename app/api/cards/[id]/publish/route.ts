import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { publishDraft } from "@/lib/server/cards/publish";

export const POST = handle(api.cards.publish, async ({ actor, params: { id } }) => ({
  version: await publishDraft({ actor, cardId: id }),
}));
