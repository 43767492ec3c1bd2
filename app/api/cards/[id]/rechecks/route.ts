import { requireApiUser } from "@/app/_adapters/session";
import { idParam, readJson, route } from "@/lib/server/http";
import { applyRechecks, listOpenRechecks } from "@/lib/server/revisions/rechecks";
import { recheckDecisionsSchema } from "@/lib/domain/validation/cards";

type Context = { params: Promise<{ id: string }> };

/** The card's citations a new revision touched, each with its old page and the suggested new one. */
export const GET = route<Context>(async (_request, { params }) => {
  await requireApiUser("cards:author");
  const cardId = idParam((await params).id, "That task card");
  return Response.json({ rechecks: await listOpenRechecks({ cardId }) });
});

/** Accept, relink or drop each; the card gets a new draft version with the decisions in it. */
export const POST = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("cards:author");
  const cardId = idParam((await params).id, "That task card");
  const { decisions } = await readJson(request, recheckDecisionsSchema);
  return Response.json({ version: await applyRechecks({ actor, cardId, decisions }) });
});
