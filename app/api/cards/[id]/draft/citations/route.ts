import { requireApiUser } from "@/app/_adapters/session";
import { citePage } from "@/lib/server/cards/draft";
import { idParam, readJson, route } from "@/lib/server/http";
import { citePageSchema } from "@/lib/domain/validation/cards";

type Context = { params: Promise<{ id: string }> };

/** "Cite while reading": the reader adds the page it shows to a step of the card's draft. */
export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("cards:author");
  const cardId = idParam((await params).id, "That task card");
  const input = await readJson(request, citePageSchema);
  const result = await citePage({ actor, cardId, ...input });
  return Response.json({ citation: result }, { status: result.added ? 201 : 200 });
});
