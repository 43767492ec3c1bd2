import { can } from "@/lib/domain/access/permissions";
import { requireApiUser } from "@/app/_adapters/session";
import { AppError } from "@/lib/domain/errors";
import { idParam, route } from "@/lib/server/http";
import { getManual } from "@/lib/server/library/manuals";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("library:view");
  const manual = await getManual({ id: idParam((await params).id, "That manual") });
  const staff = can(actor, "library:manage");
  if (!staff && !manual.currentRevisionId) throw new AppError("not_found", "That manual was not found.");
  return Response.json({
    ...manual,
    revisions: manual.revisions.filter((r) => staff || r.status === "ready").map((r) => ({
      id: r.id,
      label: r.label,
      date: r.revisionDate,
      status: r.status,
      pageCount: r.pageCount,
      supersededAt: r.supersededAt,
    })),
  });
});
