import { z } from "zod";

// Parsed once, on first use rather than at import, so `next build` can load modules without a
// database or secrets.
const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.url({ message: "DATABASE_URL must be a postgres:// URL" }),
  HL_SESSION_SECRET: z.string().min(32, "HL_SESSION_SECRET must be at least 32 characters"),
  APP_URL: z.url().default("http://localhost:3000"),
  SMTP_URL: z.url().default("smtp://127.0.0.1:2525"),
  MAIL_FROM: z.string().default("Hangarleaf <no-reply@hangarleaf.test>"),
  // Set only while the local fake SMTP server runs: enables the /outbox page.
  HL_OUTBOX_URL: z.url().optional(),
  HL_DEMO_PASSWORD: z.string().min(8).default("hangarleaf-demo"),
  // Where manuals, pages and thumbnails are kept: a folder on disk, or an S3-compatible store.
  HL_STORAGE: z.enum(["disk", "s3"]).default("disk"),
  HL_STORAGE_DIR: z.string().default(".data/files"),
  S3_BUCKET: z.string().default("hangarleaf"),
  S3_ENDPOINT: z.url().optional(),
  S3_REGION: z.string().default("us-east-1"),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  S3_FORCE_PATH_STYLE: z.enum(["0", "1"]).default("1"),
  // Search: PostgreSQL unless a Meilisearch server is named.
  MEILI_URL: z.url().optional(),
  MEILI_KEY: z.string().optional(),
  MEILI_INDEX: z
    .string()
    .regex(/^[\w-]+$/)
    .default("hangarleaf-pages"),
  // Answers kept in the web server's memory until the library changes (search/postgres.ts).
  HL_SEARCH_CACHE: z.enum(["on", "off"]).default("on"),
  HL_UPLOAD_LIMIT_BYTES: z.coerce
    .number()
    .int()
    .positive()
    .default(1024 ** 3),
});

export type Env = z.infer<typeof envSchema>;

let parsed: Env | undefined;

export function getEnv(): Env {
  if (parsed) return parsed;
  const result = envSchema.safeParse(process.env);
  if (!result.success) {
    const problems = result.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
    throw new Error(`Invalid environment: ${problems}`);
  }
  parsed = result.data;
  return parsed;
}
