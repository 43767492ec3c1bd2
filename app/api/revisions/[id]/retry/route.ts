import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { retryRevision } from "@/lib/server/library/manuals";

export const POST = handle(api.library.retryRevision, async ({ actor, params: { id } }) => {
  const retried = await retryRevision({ actor, id });
  return { revisionId: retried.id, status: "queued" as const };
});
