import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getCard } from "@/lib/server/cards/read";

export const GET = handle(api.cards.get, async ({ actor, params: { id } }) => ({ card: await getCard({ actor, id }) }));
