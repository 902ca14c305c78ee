import { defineConfig } from "@playwright/test";

const port = Number(process.env.E2E_PORT ?? 3210);
export const baseURL = `http://localhost:${port}`;

export default defineConfig({
  testDir: "./tests",
  testMatch: ["e2e/**/*.spec.ts", "integration/**/*.spec.ts"],
  // Two cores: the server takes one, the tests the other.
  workers: 1,
  fullyParallel: false,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  retries: 0,
  reporter: process.env.CI ? [["list"]] : [["list"]],
  outputDir: process.env.PW_OUTPUT_DIR ?? "test-results/playwright",
  use: {
    baseURL,
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--disable-dev-shm-usage",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--disable-default-apps",
        "--disable-extensions",
        "--no-first-run",
        "--no-default-browser-check",
      ],
    },
  },
  webServer: {
    command: "node scripts/serve-test.mjs",
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    env: { PORT: String(port) },
    stdout: "ignore",
    stderr: "pipe",
  },
});
