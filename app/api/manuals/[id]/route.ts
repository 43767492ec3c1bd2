import { requireApiUser } from "@/lib/auth/session";
import { idParam, route } from "@/lib/http";
import { getManual } from "@/lib/library/manuals";

type Context = { params: Promise<{ id: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  await requireApiUser("library:view");
  const manual = await getManual({ id: idParam((await params).id, "That manual") });
  return Response.json({
    ...manual,
    revisions: manual.revisions.map((r) => ({
      id: r.id,
      label: r.label,
      date: r.revisionDate,
      status: r.status,
      pageCount: r.pageCount,
      supersededAt: r.supersededAt,
    })),
  });
});
