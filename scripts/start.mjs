// `npm start` (production build) and `npm run dev`: everything Hangarleaf needs on one machine.
//   --dev           next dev instead of a production build
//   --only-migrate  prepare the database and migrate, then stop (npm run db:migrate)
//   --only-seed     prepare, migrate and seed, then stop (npm run db:seed)
import path from "node:path";
import { bin, dataDir, localSecret, log, run, tsx, tsxArgs } from "./steps/shell.mjs";
import { ensureDatabase, ensureNodeModules, ensurePdfTools, ensurePostgres, startCluster } from "./steps/provision.mjs";
import { assertPortFree, stopAll, supervise, waitForHttp } from "./steps/services.mjs";
import { buildIsStale, buildServiceWorker, copyPdfAssets } from "./steps/build.mjs";

const args = new Set(process.argv.slice(2));
const dev = args.has("--dev");
const onlyMigrate = args.has("--only-migrate");
const onlySeed = args.has("--only-seed");

const port = Number(process.env.PORT ?? 3000);
const pgPort = Number(process.env.HL_PG_PORT ?? 54329);
const smtpPort = Number(process.env.HL_SMTP_PORT ?? 2525);
const outboxPort = Number(process.env.HL_OUTBOX_PORT ?? 2526);
const s3Port = Number(process.env.HL_S3_PORT ?? 4568);

let cluster = null;
let stopping = false;

async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  log("stopping everything that was started");
  await stopAll();
  cluster?.stop();
  process.exit(code);
}
process.on("SIGINT", () => void shutdown(0));
process.on("SIGTERM", () => void shutdown(0));

try {
  ensureNodeModules();
  ensurePdfTools();

  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const pgBin = ensurePostgres();
    cluster = await startCluster({ bin: pgBin, home: path.join(dataDir, "postgres"), port: pgPort });
    databaseUrl = await ensureDatabase(cluster.url, "hangarleaf");
  } else {
    log("DATABASE_URL is set: using that database, no local cluster");
  }

  const useFakeMail = !process.env.SMTP_URL;
  // The fake S3 server runs unless a real store is configured; HL_STORAGE=s3 alone uses the fake.
  const useFakeS3 = !process.env.S3_ENDPOINT;
  const env = {
    ...process.env,
    NEXT_TELEMETRY_DISABLED: "1",
    NODE_ENV: dev ? "development" : "production",
    DATABASE_URL: databaseUrl,
    HL_SESSION_SECRET: process.env.HL_SESSION_SECRET ?? localSecret("session-secret"),
    APP_URL: process.env.APP_URL ?? `http://localhost:${port}`,
    SMTP_URL: process.env.SMTP_URL ?? `smtp://127.0.0.1:${smtpPort}`,
    ...(useFakeMail ? { HL_OUTBOX_URL: `http://127.0.0.1:${outboxPort}` } : {}),
    HL_STORAGE_DIR: process.env.HL_STORAGE_DIR ?? path.join(dataDir, "files"),
    ...(useFakeS3 ? { S3_ENDPOINT: `http://127.0.0.1:${s3Port}`, S3_ACCESS_KEY_ID: "S3RVER", S3_SECRET_ACCESS_KEY: "S3RVER" } : {}),
    PORT: String(port),
  };

  if (!onlyMigrate && !onlySeed) {
    // Checked first: a server already on the port would answer the health check, and this start
    // would look ready while another program served the requests.
    await assertPortFree(port, "PORT, the web app");
    if (useFakeMail) {
      await assertPortFree(smtpPort, "HL_SMTP_PORT");
      await assertPortFree(outboxPort, "HL_OUTBOX_PORT");
    }
    if (useFakeS3) await assertPortFree(s3Port, "HL_S3_PORT");
  }

  log("migrating the database");
  tsx("scripts/migrate.ts", env);
  if (onlyMigrate) await shutdown(0);

  log("seeding the demo school (skipped where it exists)");
  tsx("db/seed.ts", env);
  if (onlySeed) await shutdown(0);

  copyPdfAssets();
  if (!dev) {
    if (buildIsStale()) {
      log("building the app (next build)");
      run(bin("next"), ["build"], { env });
    } else {
      log("the production build is current");
    }
    await buildServiceWorker();
  }

  // Each service is started again when it dies (with a backoff, said in the log); the others and
  // the database go on serving.
  if (useFakeMail) {
    supervise("mail", bin("tsx"), tsxArgs("fakes/smtp.ts"), {
      ...env,
      HL_SMTP_PORT: String(smtpPort),
      HL_OUTBOX_PORT: String(outboxPort),
      HL_OUTBOX_FILE: path.join(dataDir, "outbox.jsonl"),
    });
  }
  if (useFakeS3) {
    supervise("s3", bin("tsx"), tsxArgs("fakes/s3.ts"), { ...env, HL_S3_PORT: String(s3Port), HL_S3_DIR: path.join(dataDir, "s3") });
  }
  supervise("worker", bin("tsx"), tsxArgs("worker/index.ts"), env, { pidFile: path.join(dataDir, "pids", "worker.pid") });
  supervise("web", process.execPath, ["server/web.mjs", ...(dev ? ["--dev"] : [])], env);

  await waitForHttp(`http://127.0.0.1:${port}/api/health`, dev ? 180 : 90);
  log(`Hangarleaf is ready at ${env.APP_URL}`);
  if (useFakeMail) log(`mail goes to the local fake SMTP server; read it at ${env.APP_URL}/outbox`);
  log("demo accounts are in the README; Ctrl-C stops everything");
} catch (error) {
  console.error(`[hangarleaf] ${error instanceof Error ? error.message : error}`);
  await shutdown(1);
}
