import { Readable } from "node:stream";
import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { AppError } from "@/lib/domain/errors";
import { getReadableRevision } from "@/lib/server/library/manuals";
import { parseRange } from "@/lib/domain/library/range";
import { getStore } from "@/lib/server/storage";

/** The PDF, with single-range requests so a viewer can fetch page 700 without the rest. */
export const GET = handle(api.library.revisionFile, async ({ request, actor, params: { id }, query }) => {
  const revision = await getReadableRevision({ actor, id });
  const store = getStore();
  // ?copy=reader: the packed copy made for the in-app reader, when there is one; else the upload.
  const reader = query.copy === "reader" && revision.readerFileKey && revision.readerSizeBytes;
  const fileKey = reader ? revision.readerFileKey! : revision.fileKey;
  const size = reader ? revision.readerSizeBytes! : revision.sizeBytes;
  const name = `${revision.manualTitle} ${revision.label}`.replace(/[^\w .-]+/g, "").trim() || "manual";
  const headers: Record<string, string> = {
    "Content-Type": "application/pdf",
    "Accept-Ranges": "bytes",
    "Content-Disposition": `inline; filename="${name}.pdf"`,
    "Cache-Control": "private, max-age=3600",
    ETag: `"${revision.id}${reader ? "-reader" : ""}"`,
  };
  // If-Range (RFC 9110, 13.1.5): a range of a file the client has under another tag would mix two
  // files, so a stale tag gets the whole file instead.
  const ifRange = request.headers.get("if-range");
  const range = ifRange && ifRange !== headers.ETag ? null : parseRange(request.headers.get("range"), size);
  if (range === "unsatisfiable") {
    return new Response(null, { status: 416, headers: { ...headers, "Content-Range": `bytes */${size}` } });
  }
  try {
    const { body } = await store.get(fileKey, range ?? undefined);
    const stream = Readable.toWeb(body) as ReadableStream;
    if (range) {
      return new Response(stream, {
        status: 206,
        headers: {
          ...headers,
          "Content-Range": `bytes ${range.start}-${range.end}/${size}`,
          "Content-Length": String(range.end - range.start + 1),
        },
      });
    }
    return new Response(stream, { status: 200, headers: { ...headers, "Content-Length": String(size) } });
  } catch (error) {
    throw new AppError("not_found", "The file of this revision is missing from storage.", { cause: error });
  }
});
