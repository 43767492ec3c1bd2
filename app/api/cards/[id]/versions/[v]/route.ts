import { requireApiUser } from "@/app/_adapters/session";
import { cardBodyLimit, getCardVersion, versionParams } from "@/lib/server/cards/read";
import { updateVersion } from "@/lib/server/cards/draft";
import { readJson, route } from "@/lib/server/http";
import { saveDraftSchema } from "@/lib/domain/validation/cards";

type Context = { params: Promise<{ id: string; v: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("cards:view");
  const { cardId, number } = await versionParams(params);
  return Response.json({ version: await getCardVersion({ actor, cardId, number }) });
});

/** Changes a draft version; a published one answers 409 and stays as it was. */
export const PATCH = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("cards:author");
  const { cardId, number } = await versionParams(params);
  const { content, editCount } = await readJson(request, saveDraftSchema, { maxBytes: cardBodyLimit });
  return Response.json({ version: await updateVersion({ actor, cardId, number, content, editCount }) });
});
