import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { applyRechecks, listOpenRechecks } from "@/lib/server/revisions/rechecks";

/** The card's citations a new revision touched, each with its old page and the suggested new one. */
export const GET = handle(api.cards.listRechecks, async ({ params: { id } }) => ({ rechecks: await listOpenRechecks({ cardId: id }) }));

/** Accept, relink or drop each; the card gets a new draft version with the decisions in it. */
export const POST = handle(api.cards.applyRechecks, async ({ actor, params: { id }, body: { decisions } }) => ({
  version: await applyRechecks({ actor, cardId: id, decisions }),
}));
