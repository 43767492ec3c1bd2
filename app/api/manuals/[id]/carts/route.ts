import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { setKeepOnCarts } from "@/lib/server/library/manuals";

/** "Keep on carts": carts store the whole current PDF of this manual, not only the cited pages. */
export const PUT = handle(api.library.keepOnCarts, async ({ actor, params: { id }, body: { keepOnCarts } }) =>
  setKeepOnCarts({ actor, id, keepOnCarts }),
);
