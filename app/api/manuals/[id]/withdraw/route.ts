import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { setManualWithdrawn } from "@/lib/server/library/manuals";

export const POST = handle(api.library.withdrawManual, async ({ actor, params: { id }, body: { reason } }) =>
  setManualWithdrawn({ actor, id, reason }),
);
