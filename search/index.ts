import { getEnv } from "@/lib/server/env";
import type { SearchEngine } from "./engine";
import { meilisearchEngine } from "./meilisearch";
import { postgresEngine } from "./postgres";

export type { SearchEngine, SearchFilters, SearchHit, SearchResult } from "./engine";
export { isEmptyQuery, parseQuery } from "./query";

let engine: SearchEngine | undefined;

/** PostgreSQL unless MEILI_URL names a Meilisearch server. */
export function getSearchEngine(): SearchEngine {
  if (engine) return engine;
  const env = getEnv();
  engine = env.MEILI_URL ? meilisearchEngine({ url: env.MEILI_URL, key: env.MEILI_KEY, index: env.MEILI_INDEX }) : postgresEngine;
  return engine;
}
