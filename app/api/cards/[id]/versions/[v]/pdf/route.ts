import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getCardVersion } from "@/lib/server/cards/read";
import { fileResponse, fileSlug } from "@/lib/server/file-response";
import { renderCardPdf } from "@/lib/server/pdf/card-pdf";

export const GET = handle(api.cards.versionPdf, async ({ actor, params: { id, v } }) => {
  const version = await getCardVersion({ actor, cardId: id, number: v });
  const bytes = await renderCardPdf(version);
  return fileResponse(bytes, { type: "application/pdf", filename: `${fileSlug(version.title, "task-card")}-v${version.number}.pdf` });
});
