import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { fileResponse } from "@/lib/server/file-response";
import { getRunPacket } from "@/lib/server/runs/queries";

/** The offline packet: only the pages the run's card version cites, as one small PDF. */
export const GET = handle(api.runs.packet, async ({ actor, params: { id } }) => {
  const { bytes, hash } = await getRunPacket({ actor, runId: id });
  return fileResponse(bytes, { type: "application/pdf", filename: "cited-pages.pdf", etag: hash });
});
