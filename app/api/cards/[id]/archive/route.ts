import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { setArchived } from "@/lib/server/cards/draft";

export const POST = handle(api.cards.archive, async ({ actor, params: { id }, body: { archived } }) => ({
  card: await setArchived({ actor, cardId: id, archived }),
}));
