import { requireApiUser } from "@/app/_adapters/session";
import { getCardVersion, versionParams } from "@/lib/server/cards/read";
import { fileResponse, fileSlug } from "@/lib/server/file-response";
import { route } from "@/lib/server/http";
import { renderCardPdf } from "@/lib/server/pdf/card-pdf";

type Context = { params: Promise<{ id: string; v: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("cards:view");
  const { cardId, number } = await versionParams(params);
  const version = await getCardVersion({ actor, cardId, number });
  const bytes = await renderCardPdf(version);
  return fileResponse(bytes, { type: "application/pdf", filename: `${fileSlug(version.title, "task-card")}-v${version.number}.pdf` });
});
