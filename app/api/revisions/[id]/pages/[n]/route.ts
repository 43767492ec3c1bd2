import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { getPage } from "@/lib/server/library/manuals";

export const GET = handle(api.library.page, async ({ params: { id, n } }) => {
  const page = await getPage({ revisionId: id, pageNumber: n });
  return {
    page: page.page,
    text: page.text,
    heading: page.heading,
    ocr: page.ocr,
    thumbnail: page.thumbnailKey ? `/api/revisions/${id}/pages/${page.page}/thumbnail` : null,
  };
});
