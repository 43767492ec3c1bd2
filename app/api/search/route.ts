import { requireApiUser } from "@/app/_adapters/session";
import { AppError } from "@/lib/domain/errors";
import { parseWith, route } from "@/lib/server/http";
import { searchParamsSchema } from "@/lib/domain/validation/search";
import { getSearchEngine, isEmptyQuery, parseQuery } from "@/search";

export const GET = route(async (request) => {
  await requireApiUser("library:view");
  const started = performance.now();
  const params = parseWith(searchParamsSchema, Object.fromEntries(new URL(request.url).searchParams));
  const query = parseQuery(params.q);
  if (isEmptyQuery(query)) {
    throw new AppError("invalid", "Type a word to search for (not only excluded words or punctuation).", { fields: { q: "No word to search for." } });
  }
  const result = await getSearchEngine().search(
    query,
    {
      manualId: params.manual,
      revisionId: params.revision,
      documentType: params.type,
      model: params.model,
      ata: params.ata,
      includeSuperseded: params.includeSuperseded,
    },
    { limit: params.limit, offset: params.offset },
  );
  // Not compressed (no-transform): an answer is a few kilobytes, and gzip cost more of the server's
  // one thread (1.4 ms a request, bench:search profile) than the bytes cost a shop network.
  return Response.json(
    { ...result, tookMs: Math.round((performance.now() - started) * 10) / 10 },
    { headers: { "Cache-Control": "private, no-store, no-transform" } },
  );
});
