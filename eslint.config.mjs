import js from "@eslint/js";
import nextPlugin from "@next/eslint-plugin-next";
import reactHooks from "eslint-plugin-react-hooks";
import tseslint from "typescript-eslint";

export default tseslint.config(
  {
    ignores: [
      ".next/**",
      "node_modules/**",
      ".data/**",
      "db/migrations/**",
      "test-results/**",
      "next-env.d.ts",
      "public/pdf.worker.min.mjs",
      "public/standard_fonts/**",
    ],
  },
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
      // Server-side code stays behind the session check: no reading process.env outside lib/server/env.ts.
      "no-restricted-properties": ["error", { object: "process", property: "env", message: "Use getEnv() from lib/server/env.ts." }],
    },
  },
  {
    files: ["lib/server/env.ts", "scripts/**", "fakes/**", "tests/**", "drizzle.config.ts", "playwright.config.ts", "vitest.config.ts"],
    rules: { "no-restricted-properties": "off" },
  },
  // Where code may run, enforced (DEVELOPERS.md, "Where code runs"): lib/domain and lib/contracts
  // are pure (no framework, no I/O), lib/server is server code without Next, lib/client and the
  // components are browser code, and the Next adapters live in app/_adapters.
  {
    files: ["components/**/*.{ts,tsx}", "app/**/_components/**/*.{ts,tsx}", "lib/client/**/*.ts", "service-worker/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["@/db", "@/db/*", "drizzle-orm", "drizzle-orm/*", "pg", "pg-boss"],
              message: "Browser code cannot reach the database: take the data from the API or a server component.",
            },
            {
              group: ["server-only", "next/headers", "@/lib/server/*", "@/app/_adapters/*", "@/search/*", "!@/search/query"],
              message: "A server-only module in browser code.",
            },
          ],
        },
      ],
    },
  },
  {
    files: ["lib/domain/**/*.ts", "lib/contracts/**/*.ts", "search/query.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["@/db", "@/db/*", "drizzle-orm", "drizzle-orm/*", "pg", "pg-boss", "node:*", "server-only"],
              message: "Pure domain code: no database and no I/O, so it is unit-tested without a server.",
            },
            { group: ["next", "next/*", "react", "react-dom", "react/*"], message: "Pure domain code: no framework." },
            {
              group: ["@/lib/server/*", "@/lib/client/*", "@/app/*", "@/components/*", "@/search/*", "!@/search/query"],
              message: "Pure domain code imports only pure code (lib/domain, lib/contracts, search/query).",
            },
          ],
        },
      ],
    },
  },
  {
    files: ["lib/server/**/*.ts", "search/**/*.ts", "worker/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["next", "next/*", "react", "react-dom", "react/*"],
              message: "Server code runs in the worker and the scripts too: Next belongs in app/_adapters.",
            },
            {
              group: ["@/lib/client/*", "@/app/*", "@/components/*"],
              message: "Server code does not import browser code or routing files.",
            },
          ],
        },
      ],
    },
  },
  {
    files: ["scripts/**/*.mjs", "server/**/*.mjs"],
    languageOptions: {
      globals: {
        console: "readonly",
        process: "readonly",
        fetch: "readonly",
        setTimeout: "readonly",
        setInterval: "readonly",
        clearInterval: "readonly",
        Buffer: "readonly",
      },
    },
  },
);
