// `npm run bench:NAME`: runs scripts/bench-NAME.ts against a throwaway, migrated database, with
// the same preparation as `npm test` (dependencies, PostgreSQL, PDF tools).
import { rmSync } from "node:fs";
import path from "node:path";
import { ensureNodeModules, ensurePdfTools, ensurePostgres, log, throwawayDatabase, tsx } from "./lib.mjs";

const name = process.argv[2];
if (!name) {
  console.error("usage: node scripts/bench.mjs NAME (runs scripts/bench-NAME.ts)");
  process.exit(2);
}

ensureNodeModules();
ensurePdfTools();
const database = await throwawayDatabase("hangarleaf-bench", ensurePostgres());
let code = 0;
try {
  const env = {
    ...process.env,
    NODE_ENV: "production",
    DATABASE_URL: database.url,
    HL_SESSION_SECRET: "bench-secret-that-is-long-enough-for-iron-session",
    HL_STORAGE_DIR: path.join(database.home, "files"),
  };
  tsx("scripts/migrate.ts", env);
  log(`running bench:${name}`);
  tsx(`scripts/bench-${name}.ts`, env);
} catch (error) {
  console.error(`[hangarleaf] ${error instanceof Error ? error.message : error}`);
  code = 1;
} finally {
  database.stop();
  rmSync(database.home, { recursive: true, force: true });
}
process.exit(code);
