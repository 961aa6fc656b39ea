import { defineConfig } from "@playwright/test";
import { requestStatsFile } from "./tests/e2e/support/request-stats";

const port = Number(process.env.E2E_PORT || 3100);

export default defineConfig({
  testDir: "tests/e2e",
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"]],
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    trace: "off",
    launchOptions: {
      executablePath: "/usr/bin/chromium",
      args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run", "--disable-quic"],
    },
  },
  webServer: {
    command: `node scripts/serve.mjs`,
    // Request stats: statements and session lookups per request, for the query-count spec.
    env: { PORT: String(port), HOST: "127.0.0.1", NODE_ENV: "production", LOOPKEEPER_REQUEST_STATS: requestStatsFile(port) },
    url: `http://127.0.0.1:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: "ignore",
    stderr: "pipe",
  },
});
