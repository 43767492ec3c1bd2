import { defineConfig } from "drizzle-kit";

// `npm run db:generate` needs only the schema; migrating is done by scripts/migrate.ts against the
// cluster that the start and test scripts prepare.
export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema.ts",
  out: "./db/migrations",
  dbCredentials: { url: process.env.DATABASE_URL ?? "postgres://localhost/hangarleaf" },
  strict: true,
});
