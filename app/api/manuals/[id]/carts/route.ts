import { requireApiUser } from "@/app/_adapters/session";
import { idParam, readJson, route } from "@/lib/server/http";
import { setKeepOnCarts } from "@/lib/server/library/manuals";
import { keepOnCartsSchema } from "@/lib/domain/validation/runs";

type Context = { params: Promise<{ id: string }> };

/** "Keep on carts": carts store the whole current PDF of this manual, not only the cited pages. */
export const PUT = route<Context>(async (request, { params }) => {
  const actor = await requireApiUser("library:manage");
  const id = idParam((await params).id, "That manual");
  const { keepOnCarts } = await readJson(request, keepOnCartsSchema);
  return Response.json(await setKeepOnCarts({ actor, id, keepOnCarts }));
});
