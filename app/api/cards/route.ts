import { requireApiUser } from "@/app/_adapters/session";
import { cardBodyLimit, listCards } from "@/lib/server/cards/read";
import { createCard } from "@/lib/server/cards/draft";
import { parseWith, readJson, route } from "@/lib/server/http";
import { cardListQuerySchema, createCardSchema } from "@/lib/domain/validation/cards";

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
