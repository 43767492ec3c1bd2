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
  {
    files: ["scripts/**/*.mjs", "server/**/*.mjs"],
    languageOptions: {
      globals: { console: "readonly", process: "readonly", fetch: "readonly", setTimeout: "readonly", setInterval: "readonly", clearInterval: "readonly", Buffer: "readonly" },
    },
  },
);
