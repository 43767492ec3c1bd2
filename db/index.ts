import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import { getEnv } from "@/lib/server/env";
import * as schema from "./schema";

export type Db = NodePgDatabase<typeof schema>;
/** A transaction handed to `getDb().transaction(async (tx) => …)`. */
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

// One pool per process. In development Next reloads modules, so the pool lives on globalThis
// rather than in module scope, or every reload would open another pool.
const cache = globalThis as unknown as { hangarleafPool?: pg.Pool; hangarleafDb?: Db };

export function getPool(): pg.Pool {
  if (!cache.hangarleafPool) {
    cache.hangarleafPool = new pg.Pool({
      connectionString: getEnv().DATABASE_URL,
      max: 20,
      idleTimeoutMillis: 30_000,
      connectionTimeoutMillis: 5_000,
    });
    cache.hangarleafPool.on("error", (error) => console.error("postgres pool error", error));
  }
  return cache.hangarleafPool;
}

export function getDb(): Db {
  cache.hangarleafDb ??= drizzle(getPool(), { schema });
  return cache.hangarleafDb;
}

export async function closeDb(): Promise<void> {
  const pool = cache.hangarleafPool;
  cache.hangarleafPool = undefined;
  cache.hangarleafDb = undefined;
  await pool?.end();
}

export { schema };
