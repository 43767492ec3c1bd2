import { requireApiUser } from "@/app/_adapters/session";
import { cardBodyLimit } from "@/lib/server/cards/read";
import { discardDraft, saveDraft } from "@/lib/server/cards/draft";
import { idParam, readJson, route } from "@/lib/server/http";
import { saveDraftSchema } from "@/lib/domain/validation/cards";

type Context = { params: Promise<{ id: string }> };

/** Saves the draft; on a published card this opens a new draft version. */
export const PUT = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("cards:author");
  const cardId = idParam((await params).id, "That task card");
  const { content, editCount } = await readJson(request, saveDraftSchema, { maxBytes: cardBodyLimit });
  return Response.json({ version: await saveDraft({ actor, cardId, content, editCount }) });
});

export const DELETE = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("cards:author");
  const cardId = idParam((await params).id, "That task card");
  await discardDraft({ actor, cardId });
  return new Response(null, { status: 204 });
});
