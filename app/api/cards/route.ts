import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { createCard } from "@/lib/server/cards/draft";
import { listCards } from "@/lib/server/cards/read";

export const GET = handle(api.cards.list, async ({ actor, query }) => ({ cards: await listCards({ actor, filters: query }) }));

export const POST = handle(api.cards.create, async ({ actor, body: { content } }) => ({ card: await createCard({ actor, content }) }));
