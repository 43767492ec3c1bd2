import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { citePage } from "@/lib/server/cards/draft";

/** "Cite while reading": the reader adds the page it shows to a step of the card's draft. */
export const POST = handle(api.cards.citePage, async ({ actor, params: { id }, body }) => {
  const citation = await citePage({ actor, cardId: id, ...body });
  return Response.json({ citation }, { status: citation.added ? 201 : 200 });
});
