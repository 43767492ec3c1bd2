import { requireApiUser } from "@/lib/auth/session";
import { fileResponse } from "@/lib/file-response";
import { idParam, route } from "@/lib/http";
import { getRunPacket } from "@/lib/runs/runs";

type Context = { params: Promise<{ id: string }> };

/** The offline packet: only the pages the run's card version cites, as one small PDF. */
export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser();
  const { bytes, hash } = await getRunPacket({ actor, runId: idParam((await params).id, "That run") });
  return fileResponse(bytes, { type: "application/pdf", filename: "cited-pages.pdf", etag: hash });
});
