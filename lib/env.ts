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
