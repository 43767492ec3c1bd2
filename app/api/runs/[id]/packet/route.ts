import { requireApiUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { idParam, route } from "@/lib/http";
import { packetBytes, packetFor } from "@/lib/runs/packet";
import { getRunDetail } from "@/lib/runs/runs";
import { getDb } from "@/db";

type Context = { params: Promise<{ id: string }> };

/** The offline packet: only the pages the run's card version cites, as one small PDF. */
export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser();
  const { version } = await getRunDetail({ actor, runId: idParam((await params).id, "That run") });
  const plan = await packetFor(getDb(), version);
  if (!plan.pages.length) throw new AppError("not_found", "This card cites no manual pages.");
  const bytes = await packetBytes(getDb(), plan);
  return new Response(Buffer.from(bytes), {
    headers: { "Content-Type": "application/pdf", "Content-Disposition": 'inline; filename="cited-pages.pdf"', "Cache-Control": "private, no-store", ETag: `"${plan.hash}"` },
  });
});
