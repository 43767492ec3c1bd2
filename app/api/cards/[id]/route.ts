import { requireApiUser } from "@/app/_adapters/session";
import { getCard } from "@/lib/server/cards/read";
import { idParam, route } from "@/lib/server/http";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("cards:view");
  const id = idParam((await params).id, "That task card");
  return Response.json({ card: await getCard({ actor, id }) });
});
