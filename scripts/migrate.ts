// Brings the database to the current schema: drizzle's migrations, then pg-boss's own tables and
// our queues. Run by `npm start`, `npm test` and `npm run db:migrate`.
import { migrate } from "drizzle-orm/node-postgres/migrator";
import PgBoss from "pg-boss";
import { closeDb, getDb } from "../db";
import { getEnv } from "@/lib/server/env";
import { createQueues } from "@/lib/server/jobs";

async function main() {
  await migrate(getDb(), { migrationsFolder: "db/migrations" });
  const boss = new PgBoss({ connectionString: getEnv().DATABASE_URL, supervise: false, schedule: false, max: 2 });
  boss.on("error", (error) => console.error(error));
  await boss.start();
  await createQueues(boss);
  await boss.stop({ graceful: false, wait: true });
  await closeDb();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
