#!/usr/bin/env node
// `npm test`: the same preparation as `npm start` against a separate test database, then
// lint, typecheck, unit, integration (real PostgreSQL) and end-to-end tests (Debian's chromium).
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import { firstRunCheck } from "./first-run-check.mjs";
import { log, fail } from "./log.mjs";
import { prepare, run } from "./prepare.mjs";

const E2E_PORT = Number(process.env.E2E_PORT || 3100);
const CHROMIUM = "/usr/bin/chromium";

function ensureChromium() {
  if (fs.existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) fail(`Debian's chromium is needed for the browser tests: sudo apt-get install -y chromium`);
  log("Installing Debian's chromium for the browser tests…");
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
  execFileSync("apt-get", ["install", "-y", "-qq", "chromium"], { stdio: "inherit", env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" } });
}

const only = process.argv[2]; // optional: first-run | lint | unit | integration | e2e
if (!only || only === "first-run") await firstRunCheck();
if (only === "first-run") process.exit(0);
const env = await prepare({ database: "loopkeeper_test", port: E2E_PORT });
const testEnv = { ...env, LOOPKEEPER_LOG: "silent", NEXT_DIST_DIR: ".next-test" };

if (!only || only === "lint") {
  run("npx", ["eslint", ".", "--max-warnings", "0"], testEnv, "Lint (ESLint)…");
  run("npx", ["tsc", "--noEmit"], testEnv, "Typecheck (tsc)…");
}
if (!only || only === "unit") run("npx", ["vitest", "run", "--project", "unit"], testEnv, "Unit tests…");
if (!only || only === "integration") run("npx", ["vitest", "run", "--project", "integration"], testEnv, "Integration tests (PostgreSQL)…");
if (!only || only === "e2e") {
  ensureChromium();
  run("npx", ["next", "build"], { ...testEnv, NODE_ENV: "production" }, "Building the app for the browser tests…");
  // Loaded only now: it needs packages that prepare() installs on a fresh machine.
  const { startFakes } = await import("./fakes.mjs");
  const fakes = await startFakes(testEnv);
  try {
    run("npx", ["playwright", "test"], { ...testEnv, ...fakes.env, E2E_PORT: String(E2E_PORT) }, "End-to-end tests (Playwright, Debian's chromium)…");
  } finally {
    await fakes.stop();
  }
}
log("All tests passed.");
