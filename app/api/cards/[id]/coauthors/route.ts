import { requireApiUser } from "@/app/_adapters/session";
import { setCoauthors } from "@/lib/server/cards/access";
import { idParam, readJson, route } from "@/lib/server/http";
import { coauthorsSchema } from "@/lib/domain/validation/cards";

type Context = { params: Promise<{ id: string }> };

/** The owner (or an admin) names who may edit the card beside them; the list replaces the old one. */
export const PUT = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("cards:author");
  const cardId = idParam((await params).id, "That task card");
  const { userIds } = await readJson(request, coauthorsSchema);
  return Response.json({ coauthors: await setCoauthors({ actor, cardId, userIds }) });
});
