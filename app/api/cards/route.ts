import { requireApiUser } from "@/lib/auth/session";
import { cardBodyLimit, createCard, listCards } from "@/lib/cards";
import { parseWith, readJson, route } from "@/lib/http";
import { cardListQuerySchema, createCardSchema } from "@/lib/validation/cards";

export const GET = route(async (request) => {
  const actor = await requireApiUser("cards:view");
  const filters = parseWith(cardListQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  return Response.json({ cards: await listCards({ actor, filters }) });
});

export const POST = route(async (request) => {
  const actor = await requireApiUser("cards:author");
  const { content } = await readJson(request, createCardSchema, { maxBytes: cardBodyLimit });
  return Response.json({ card: await createCard({ actor, content }) }, { status: 201 });
});
