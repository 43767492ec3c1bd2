import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { discardDraft, saveDraft } from "@/lib/server/cards/draft";

/** Saves the draft; on a published card this opens a new draft version. */
export const PUT = handle(api.cards.saveDraft, async ({ actor, params: { id }, body: { content, editCount } }) => ({
  version: await saveDraft({ actor, cardId: id, content, editCount }),
}));

export const DELETE = handle(api.cards.discardDraft, async ({ actor, params: { id } }) => {
  await discardDraft({ actor, cardId: id });
});
