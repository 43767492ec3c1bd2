import { fileResponse } from "@/lib/server/file-response";
import { requireApiUser } from "@/app/_adapters/session";
import { AppError } from "@/lib/domain/errors";
import { idParam, parseWith, route } from "@/lib/server/http";
import { getPage } from "@/lib/server/library/manuals";
import { getStore } from "@/lib/server/storage";
import { pageNumberSchema } from "@/lib/domain/validation/library";

type Context = { params: Promise<{ id: string; n: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  await requireApiUser("library:view");
  const { id, n } = await params;
  const page = await getPage({ revisionId: idParam(id, "That revision"), pageNumber: parseWith(pageNumberSchema, n) });
  if (!page.thumbnailKey) throw new AppError("not_found", "This page has no thumbnail yet.");
  const { body, size } = await getStore().get(page.thumbnailKey);
  return fileResponse(body, { type: "image/png", size, cache: "private, max-age=86400, immutable" });
});
