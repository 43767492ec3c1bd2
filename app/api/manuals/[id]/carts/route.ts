import { requireApiUser } from "@/lib/auth/session";
import { idParam, readJson, route } from "@/lib/http";
import { setKeepOnCarts } from "@/lib/library/manuals";
import { keepOnCartsSchema } from "@/lib/validation/runs";

type Context = { params: Promise<{ id: string }> };

/** "Keep on carts": carts store the whole current PDF of this manual, not only the cited pages. */
export const PUT = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("library:manage");
  const id = idParam((await params).id, "That manual");
  const { keepOnCarts } = await readJson(request, keepOnCartsSchema);
  return Response.json(await setKeepOnCarts({ actor, id, keepOnCarts }));
});
