import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { duplicateCard } from "@/lib/server/cards/draft";

export const POST = handle(api.cards.duplicate, async ({ actor, params: { id } }) => ({
  card: await duplicateCard({ actor, cardId: id }),
}));
