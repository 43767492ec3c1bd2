import { requireApiUser } from "@/app/_adapters/session";
import { fileResponse } from "@/lib/server/file-response";
import { idParam, route } from "@/lib/server/http";
import { getRunPacket } from "@/lib/server/runs/queries";

type Context = { params: Promise<{ id: string }> };

/** The offline packet: only the pages the run's card version cites, as one small PDF. */
export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser();
  const { bytes, hash } = await getRunPacket({ actor, runId: idParam((await params).id, "That run") });
  return fileResponse(bytes, { type: "application/pdf", filename: "cited-pages.pdf", etag: hash });
});
