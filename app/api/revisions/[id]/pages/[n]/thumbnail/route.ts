import { fileResponse } from "@/lib/file-response";
import { requireApiUser } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { idParam, parseWith, route } from "@/lib/http";
import { getPage } from "@/lib/library/manuals";
import { getStore } from "@/lib/storage";
import { pageNumberSchema } from "@/lib/validation/library";

type Context = { params: Promise<{ id: string; n: string }> };

export const GET = route<Context>(async (_request, { params }) => {
  await requireApiUser("library:view");
  const { id, n } = await params;
  const page = await getPage({ revisionId: idParam(id, "That revision"), pageNumber: parseWith(pageNumberSchema, n) });
  if (!page.thumbnailKey) throw new AppError("not_found", "This page has no thumbnail yet.");
  const { body, size } = await getStore().get(page.thumbnailKey);
  return fileResponse(body, { type: "image/png", size, cache: "private, max-age=86400, immutable" });
});
