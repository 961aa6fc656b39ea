#!/usr/bin/env node
// `npm test`: the same preparation as `npm start` against a separate test database, then
// lint, typecheck, unit (with Debian's gcc for the C reference), integration (real PostgreSQL) and
// end-to-end tests (Debian's chromium).
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import { firstRunCheck } from "./first-run-check.mjs";
import { log, fail } from "./log.mjs";
import { prepare, run } from "./prepare.mjs";

const E2E_PORT = Number(process.env.E2E_PORT || 3100);
const CHROMIUM = "/usr/bin/chromium";
const GCC = "/usr/bin/gcc";

/** Installs a Debian package when its program is missing (as root), like scripts/pg.mjs does for PostgreSQL. */
function ensureDebianPackage(program, pkg, why) {
  if (fs.existsSync(program)) return;
  if (process.getuid?.() !== 0) fail(`Debian's ${pkg} is needed ${why}: sudo apt-get install -y ${pkg}`);
  log(`Installing Debian's ${pkg} ${why}…`);
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
  execFileSync("apt-get", ["install", "-y", "-qq", pkg], { stdio: "inherit", env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" } });
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
if (!only || only === "unit") {
  ensureDebianPackage(GCC, "gcc", "to compile the C reference the unit tests run against the firmware vectors");
  run("npx", ["vitest", "run", "--project", "unit"], testEnv, "Unit tests…");
}
if (!only || only === "integration") run("npx", ["vitest", "run", "--project", "integration"], testEnv, "Integration tests (PostgreSQL)…");
if (!only || only === "e2e") {
  ensureDebianPackage(CHROMIUM, "chromium", "for the browser tests");
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
