import { requireApiUser } from "@/lib/auth/session";
import { getCardVersion, versionParams } from "@/lib/cards";
import { route } from "@/lib/http";
import { renderCardPdf } from "@/lib/pdf/card-pdf";

type Context = { params: Promise<{ id: string; v: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  const actor = await requireApiUser("cards:view");
  const { cardId, number } = await versionParams(params);
  const version = await getCardVersion({ actor, cardId, number });
  const bytes = await renderCardPdf(version);
  const name = `${version.title.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || "task-card"}-v${version.number}.pdf`;
  return new Response(Buffer.from(bytes), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `inline; filename="${name}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
