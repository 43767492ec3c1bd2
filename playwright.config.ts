import { defineConfig } from "@playwright/test";

// Debian's Chromium, started by the test script's environment; no browser download.
const chromium = process.env.HL_CHROMIUM ?? "/usr/bin/chromium";
const baseURL = process.env.HL_BASE_URL ?? "http://localhost:3000";

export default defineConfig({
  testDir: "tests/e2e",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json"]],
  outputDir: "test-results",
  use: {
    baseURL,
    viewport: { width: 1366, height: 768 },
    screenshot: "only-on-failure",
    trace: "off",
    launchOptions: {
      executablePath: chromium,
      args: [
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
      ],
    },
  },
});
