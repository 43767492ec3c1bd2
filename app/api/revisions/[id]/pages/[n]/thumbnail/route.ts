import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { AppError } from "@/lib/domain/errors";
import { fileResponse } from "@/lib/server/file-response";
import { getPage } from "@/lib/server/library/manuals";
import { getStore } from "@/lib/server/storage";

export const GET = handle(api.library.thumbnail, async ({ params: { id, n } }) => {
  const page = await getPage({ revisionId: id, pageNumber: n });
  if (!page.thumbnailKey) throw new AppError("not_found", "This page has no thumbnail yet.");
  const { body, size } = await getStore().get(page.thumbnailKey);
  return fileResponse(body, { type: "image/png", size, cache: "private, max-age=86400, immutable" });
});
