import { requireApiUser } from "@/app/_adapters/session";
import { publishDraft } from "@/lib/server/cards/publish";
import { idParam, route } from "@/lib/server/http";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("cards:author");
  const cardId = idParam((await params).id, "That task card");
  return Response.json({ version: await publishDraft({ actor, cardId }) });
});
