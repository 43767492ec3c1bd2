import { requireApiUser } from "@/lib/auth/session";
import { getCard } from "@/lib/cards";
import { idParam, route } from "@/lib/http";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("cards:view");
  const id = idParam((await params).id, "That task card");
  return Response.json({ card: await getCard({ actor, id }) });
});
