import { requireApiUser } from "@/app/_adapters/session";
import { setArchived } from "@/lib/server/cards/draft";
import { idParam, readJson, route } from "@/lib/server/http";
import { archiveSchema } from "@/lib/domain/validation/cards";

type Context = { params: Promise<{ id: string }> };

export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("cards:author");
  const cardId = idParam((await params).id, "That task card");
  const { archived } = await readJson(request, archiveSchema);
  return Response.json({ card: await setArchived({ actor, cardId, archived }) });
});
