import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { renameSubject } from "@/lib/server/cards/subjects";

export const PATCH = handle(api.cards.renameSubject, async ({ actor, params: { id }, body: { name } }) => ({
  subject: await renameSubject({ actor, id, name }),
}));
