import js from "@eslint/js";
import nextPlugin from "@next/eslint-plugin-next";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

export default tseslint.config(
  { ignores: [".next/**", "node_modules/**", ".data/**", "db/migrations/**", "test-results/**", "next-env.d.ts", "public/pdf.worker.min.mjs", "public/standard_fonts/**"] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ["**/*.{ts,tsx}"],
    plugins: { "@next/next": nextPlugin, "react-hooks": reactHooks },
    rules: {
      ...nextPlugin.configs.recommended.rules,
      ...nextPlugin.configs["core-web-vitals"].rules,
      ...reactHooks.configs.recommended.rules,
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/consistent-type-imports": ["error", { fixStyle: "inline-type-imports" }],
      // Server-side code stays behind the session check: no reading process.env outside lib/env.ts.
      "no-restricted-properties": ["error", { object: "process", property: "env", message: "Use getEnv() from lib/env.ts." }],
    },
  },
  {
    files: ["lib/env.ts", "scripts/**", "fakes/**", "tests/**", "drizzle.config.ts", "playwright.config.ts", "vitest.config.ts"],
    rules: { "no-restricted-properties": "off" },
  },
  // Where code may run, enforced: browser code never reaches the database or server-only modules,
  // and the pure domain modules take no framework and no I/O (DEVELOPERS.md, "Where code runs").
  {
    files: ["components/**/*.{ts,tsx}", "app/**/_components/**/*.{ts,tsx}", "lib/cart/**/*.ts", "lib/api-client.ts", "lib/citing-target.ts", "worker/service/**/*.ts"],
    rules: {
      "no-restricted-imports": ["error", {
        patterns: [
          { group: ["@/db", "@/db/*", "../db", "../db/*", "drizzle-orm", "drizzle-orm/*", "pg", "pg-boss"], message: "Browser code cannot reach the database: take the data from the API or a server component." },
          { group: ["server-only", "@/lib/auth/session", "next/headers"], message: "A server-only module in browser code." },
        ],
      }],
    },
  },
  {
    files: ["lib/calc/**/*.ts", "lib/runs/fold.ts", "lib/runs/hours.ts", "lib/runs/work-status.ts", "lib/revisions/compare.ts", "search/query.ts", "lib/edge.ts", "lib/vocabulary.ts", "lib/escape.ts", "lib/auth/permissions.ts", "lib/auth/throttle.ts", "lib/pdf/text.ts"],
    rules: {
      "no-restricted-imports": ["error", {
        patterns: [
          { group: ["@/db", "@/db/*", "drizzle-orm", "drizzle-orm/*", "pg", "pg-boss", "node:*", "server-only"], message: "Pure domain code: no database and no I/O, so it is unit-tested without a server." },
          { group: ["next", "next/*", "react", "react-dom", "react/*"], message: "Pure domain code: no framework." },
        ],
      }],
    },
  },
  {
    files: ["scripts/**/*.mjs", "server/**/*.mjs"],
    languageOptions: {
      globals: { console: "readonly", process: "readonly", fetch: "readonly", setTimeout: "readonly", setInterval: "readonly", clearInterval: "readonly", Buffer: "readonly" },
    },
  },
);
