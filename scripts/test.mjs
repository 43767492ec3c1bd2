// `npm test`: the preparation of `npm start` on a throwaway cluster and ports, then typecheck, lint,
// unit and integration tests (vitest, real PostgreSQL and a real server), and end-to-end tests
// (Playwright driving Debian's Chromium). Every stage runs even when an earlier one failed, except
// those that need the build; the exit code is non-zero when any stage failed.
import { existsSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { bin, log, run, runAsync, tsx, tsxArgs } from "./steps/shell.mjs";
import { ensureChromium, ensureNodeModules, ensurePdfTools, ensurePostgres, throwawayDatabase } from "./steps/provision.mjs";
import { freePort, stopAll, supervise, waitForHttp } from "./steps/services.mjs";
import { buildServiceWorker, copyPdfAssets } from "./steps/build.mjs";

// `npm test -- --e2e-only [spec files…]`: the same preparation and build, then only Playwright on
// the named specs (all when none are named); for working on a screen without the whole suite.
// `npm test -- --vitest-only [test files…]`: the same, with only vitest on the named files.
const e2eOnly = process.argv.includes("--e2e-only");
const vitestOnly = process.argv.includes("--vitest-only");
const partial = e2eOnly || vitestOnly;
const specs = process.argv.slice(2).filter((a) => !a.startsWith("--"));

const results = [];
let cluster = null;
let home = null;

async function stage(name, fn) {
  log(`── ${name}`);
  const started = Date.now();
  try {
    await fn();
    results.push({ name, ok: true, seconds: (Date.now() - started) / 1000 });
    return true;
  } catch (error) {
    console.error(`[hangarleaf] ${name} failed: ${error instanceof Error ? error.message : error}`);
    results.push({ name, ok: false, seconds: (Date.now() - started) / 1000 });
    return false;
  }
}

function readJson(file) {
  try {
    return existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : null;
  } catch {
    return null;
  }
}

async function waitForDemoIngest(url) {
  const { default: pg } = await import("pg");
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    for (let i = 0; i < 600; i++) {
      const { rows } = await client.query(
        "select count(*)::int as waiting from revisions where status in ('queued', 'processing') or (status = 'ready' and id not in (select revision_id from revision_comparisons))",
      );
      if (rows[0].waiting === 0) return;
      await new Promise((r) => setTimeout(r, 1000));
    }
    throw new Error("the demo manuals were not read within 10 minutes");
  } finally {
    await client.end();
  }
}

async function cleanup() {
  await stopAll();
  cluster?.stop();
  if (home) rmSync(home, { recursive: true, force: true });
}
process.on("SIGINT", () => void cleanup().then(() => process.exit(130)));

let exitCode = 1;
try {
  ensureNodeModules();
  const pgBin = ensurePostgres();
  ensurePdfTools();
  const chromium = ensureChromium();

  const database = await throwawayDatabase("hangarleaf-test", pgBin);
  home = database.home;
  cluster = database;
  const databaseUrl = database.url;
  const [webPort, smtpPort, outboxPort, s3Port] = [await freePort(), await freePort(), await freePort(), await freePort()];
  const reports = path.join(home, "reports");

  const env = {
    ...process.env,
    NEXT_TELEMETRY_DISABLED: "1",
    NODE_ENV: "production",
    DATABASE_URL: databaseUrl,
    HL_SESSION_SECRET: "test-secret-that-is-long-enough-for-iron-session",
    APP_URL: `http://localhost:${webPort}`,
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    HL_OUTBOX_URL: `http://127.0.0.1:${outboxPort}`,
    HL_SMTP_PORT: String(smtpPort),
    HL_OUTBOX_PORT: String(outboxPort),
    HL_BASE_URL: `http://localhost:${webPort}`,
    HL_CHROMIUM: chromium,
    HL_STORAGE_DIR: path.join(home, "files"),
    // Small, so the too-large case is tested without sending a gigabyte.
    HL_UPLOAD_LIMIT_BYTES: String(8 * 1024 * 1024),
    // The app stores on disk; tests/integration/storage.test.ts runs the S3 path against this fake.
    HL_S3_PORT: String(s3Port),
    HL_S3_DIR: path.join(home, "s3"),
    HL_TEST_S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
    PORT: String(webPort),
    // The tests send made-up client addresses (tests/support/http.ts fakeAddress) through the
    // loopback as if from a proxy; without this setting the web server believes only the socket.
    HL_TRUSTED_PROXIES: "127.0.0.1 ::1",
    // Where the supervisor writes the worker's pid: the test that kills it mid-ingest reads it.
    HL_PIDS_DIR: path.join(home, "pids"),
  };
  // vitest and Playwright are tools, not the app: they run in the test environment.
  const testEnv = { ...env, NODE_ENV: "test" };

  await stage("migrate and seed", () => {
    tsx("scripts/migrate.ts", env);
    tsx("db/seed.ts", env);
    tsx("db/seed.ts", env); // twice: the seed must be idempotent (tests/integration/seed.test.ts checks)
  });
  if (!partial) await stage("typecheck", () => run(bin("tsc"), ["--noEmit"], { env }));
  if (!partial)
    await stage("lint", () => {
      run(bin("eslint"), ["--max-warnings", "0", "."], { env });
      // The formatter's line width (.prettierrc.json); `npx prettier --write .` fixes what this finds.
      run(bin("prettier"), ["--check", "--log-level", "warn", "."], { env });
    });
  copyPdfAssets();
  let built = await stage("build", () => run(bin("next"), ["build"], { env }));
  if (built) {
    try {
      await buildServiceWorker();
    } catch (error) {
      console.error(`[hangarleaf] the service worker failed to build: ${error instanceof Error ? error.message : error}`);
      results.push({ name: "service worker", ok: false, seconds: 0 });
      built = false;
    }
  }

  let vitest = null;
  let playwright = null;
  if (built) {
    supervise("mail", bin("tsx"), tsxArgs("fakes/smtp.ts"), env);
    supervise("s3", bin("tsx"), tsxArgs("fakes/s3.ts"), env);
    supervise("worker", bin("tsx"), tsxArgs("worker/index.ts"), env, { pidFile: path.join(env.HL_PIDS_DIR, "worker.pid") });
    supervise("web", process.execPath, ["server/web.mjs"], env);
    await waitForHttp(`http://127.0.0.1:${webPort}/api/health`);
    await waitForHttp(`${env.HL_OUTBOX_URL}/messages`);

    const vitestReport = path.join(reports, "vitest.json");
    if (!e2eOnly) {
      await stage("unit and integration tests (vitest)", () =>
        runAsync(
          bin("vitest"),
          ["run", "--reporter=default", "--reporter=json", `--outputFile.json=${vitestReport}`, ...(vitestOnly ? specs : [])],
          { env: testEnv },
        ),
      );
      vitest = readJson(vitestReport);
    }

    // The whole run gives the worker the vitest stage's minutes to read the demo manuals; alone,
    // the end-to-end tests wait for it here.
    if (e2eOnly) await waitForDemoIngest(databaseUrl);
    const playwrightReport = path.join(reports, "playwright.json");
    if (!vitestOnly) {
      await stage("end-to-end tests (Playwright, Chromium)", () =>
        runAsync(bin("playwright"), ["test", ...specs], { env: { ...testEnv, PLAYWRIGHT_JSON_OUTPUT_NAME: playwrightReport } }),
      );
      playwright = readJson(playwrightReport);
    }
  }

  log("── summary");
  for (const r of results) log(`${r.ok ? "ok  " : "FAIL"} ${r.name} (${r.seconds.toFixed(1)} s)`);
  const passed = (vitest?.numPassedTests ?? 0) + (playwright?.stats?.expected ?? 0);
  const failed = (vitest?.numFailedTests ?? 0) + (playwright?.stats?.unexpected ?? 0) + (playwright?.stats?.flaky ?? 0);
  const skipped = (vitest?.numPendingTests ?? 0) + (vitest?.numTodoTests ?? 0) + (playwright?.stats?.skipped ?? 0);
  const allOk = results.every((r) => r.ok) && built;
  console.log(`tests: ${passed} passed, ${failed} failed, ${skipped} skipped`);
  exitCode = allOk && failed === 0 && passed > 0 ? 0 : 1;
} catch (error) {
  console.error(`[hangarleaf] ${error instanceof Error ? error.stack : error}`);
} finally {
  await cleanup();
}
process.exit(exitCode);
