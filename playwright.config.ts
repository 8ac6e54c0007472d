import { defineConfig } from "@playwright/test";

const port = Number(process.env.E2E_PORT ?? 3310);

/** End-to-end tests in Debian's Chromium against the production build (`npm test` builds it first). */
export default defineConfig({
  testDir: "tests/e2e",
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [["list"]],
  use: {
    baseURL: `http://localhost:${port}`,
    trace: "retain-on-failure",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
        "--disable-background-networking", "--disable-component-update", "--disable-sync",
      ],
    },
  },
  webServer: {
    command: `npx next start -p ${port}`,
    url: `http://localhost:${port}/api/health`,
    timeout: 60_000,
    reuseExistingServer: false,
    stdout: "ignore",
    stderr: "pipe",
  },
});
