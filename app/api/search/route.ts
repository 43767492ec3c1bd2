import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { AppError } from "@/lib/domain/errors";
import { getSearchEngine, isEmptyQuery, parseQuery } from "@/search";

export const GET = handle(api.library.search, async ({ query: params }) => {
  const started = performance.now();
  const query = parseQuery(params.q);
  if (isEmptyQuery(query)) {
    throw new AppError("invalid", "Type a word to search for (not only excluded words or punctuation).", {
      fields: { q: "No word to search for." },
    });
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
  return { ...result, tookMs: Math.round((performance.now() - started) * 10) / 10 };
});
