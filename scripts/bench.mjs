// `npm run bench:NAME`: runs scripts/bench-NAME.ts against a throwaway, migrated database, with
// the same preparation as `npm test` (dependencies, PostgreSQL, PDF tools).
import { rmSync } from "node:fs";
import path from "node:path";
import { bin, log, run, tsx, tsxArgs } from "./steps/shell.mjs";
import { ensureChromium, ensureNodeModules, ensurePdfTools, ensurePostgres, throwawayDatabase } from "./steps/provision.mjs";
import { freePort, service, stopAll, waitForHttp } from "./steps/services.mjs";
import { buildIsStale, copyPdfAssets } from "./steps/build.mjs";

// Benchmarks that measure the API need the real web server.
const needsWeb = new Set(["search", "reader", "sync", "load"]);
// …and the reader's file must first be read by the worker, in Chromium.
const needsWorker = new Set(["reader", "load"]);

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
  copyPdfAssets();
  // The class in bench:load signs in from 50 addresses through the loopback, as through a proxy.
  if (name === "load") env.HL_TRUSTED_PROXIES = "127.0.0.1 ::1";
  if (needsWeb.has(name)) {
    if (buildIsStale()) run(bin("next"), ["build"], { env: { ...env, NEXT_TELEMETRY_DISABLED: "1" } });
    const port = await freePort();
    const web = service("web", process.execPath, ["server/web.mjs"], { ...env, PORT: String(port), NEXT_TELEMETRY_DISABLED: "1" });
    env.HL_WEB_PID = String(web.pid); // for benchmarks that report the server's CPU time
    env.HL_BASE_URL = `http://127.0.0.1:${port}`;
    await waitForHttp(`${env.HL_BASE_URL}/api/health`);
    if (name === "search") {
      // A second server that keeps no answers, to measure the search itself beside the kept ones.
      const uncachedPort = await freePort();
      const uncached = service("web-uncached", process.execPath, ["server/web.mjs"], {
        ...env,
        PORT: String(uncachedPort),
        NEXT_TELEMETRY_DISABLED: "1",
        HL_SEARCH_CACHE: "off",
      });
      env.HL_UNCACHED_PID = String(uncached.pid);
      env.HL_UNCACHED_URL = `http://127.0.0.1:${uncachedPort}`;
      await waitForHttp(`${env.HL_UNCACHED_URL}/api/health`);
    }
    if (needsWorker.has(name)) {
      env.HL_CHROMIUM = ensureChromium();
      service("worker", bin("tsx"), tsxArgs("worker/index.ts"), env);
    }
  }
  log(`running bench:${name}`);
  tsx(`scripts/bench-${name}.ts`, env);
} catch (error) {
  console.error(`[hangarleaf] ${error instanceof Error ? error.message : error}`);
  code = 1;
} finally {
  await stopAll();
  database.stop();
  rmSync(database.home, { recursive: true, force: true });
}
process.exit(code);
