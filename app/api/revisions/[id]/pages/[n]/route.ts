import { requireApiUser } from "@/app/_adapters/session";
import { idParam, parseWith, route } from "@/lib/server/http";
import { getPage } from "@/lib/server/library/manuals";
import { pageNumberSchema } from "@/lib/domain/validation/library";

type Context = { params: Promise<{ id: string; n: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  await requireApiUser("library:view");
  const { id, n } = await params;
  const page = await getPage({ revisionId: idParam(id, "That revision"), pageNumber: parseWith(pageNumberSchema, n) });
  return Response.json({
    page: page.page,
    text: page.text,
    heading: page.heading,
    ocr: page.ocr,
    thumbnail: page.thumbnailKey ? `/api/revisions/${id}/pages/${page.page}/thumbnail` : null,
  });
});
