import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { can } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";
import { getManual, updateManualDetails } from "@/lib/server/library/manuals";

export const GET = handle(api.library.getManual, async ({ actor, params: { id } }) => {
  const manual = await getManual({ id });
  const staff = can(actor, "library:manage");
  if (!staff && !manual.currentRevisionId) throw new AppError("not_found", "That manual was not found.");
  return {
    ...manual,
    revisions: manual.revisions
      .filter((r) => staff || r.status === "ready")
      .map((r) => ({
        id: r.id,
        label: r.label,
        date: r.revisionDate,
        status: r.status,
        pageCount: r.pageCount,
        supersededAt: r.supersededAt,
      })),
  };
});

export const PATCH = handle(api.library.updateManual, async ({ actor, params: { id }, body }) => ({
  manual: await updateManualDetails({ actor, id, fields: body }),
}));
