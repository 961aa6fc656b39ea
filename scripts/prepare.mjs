#!/usr/bin/env node
// Everything `npm start` and `npm test` need before the app runs: dependencies, a secret,
// PostgreSQL on loopback, migrations and the demo data. Safe to run any number of times.
import { execFileSync, spawnSync } from "node:child_process";
import { generateKeyPairSync, randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { log, fail } from "./log.mjs";

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

export function ensureDependencies() {
  const marker = path.join(root, "node_modules", ".package-lock.json");
  const lock = path.join(root, "package-lock.json");
  if (fs.existsSync(marker) && fs.statSync(marker).mtimeMs >= fs.statSync(lock).mtimeMs - 1000) return;
  log("Installing dependencies (npm ci)…");
  const r = spawnSync("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit", env: { ...process.env, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: "1" } });
  if (r.status !== 0) fail("npm ci failed; see the output above.");
}

/** A random session secret generated once per checkout and kept in the ignored .data folder. */
function localSecret() {
  const file = path.join(root, ".data", "nextauth-secret");
  fs.mkdirSync(path.dirname(file), { recursive: true });
  if (!fs.existsSync(file)) fs.writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  return fs.readFileSync(file, "utf8").trim();
}

/**
 * The demo bank-signing key (Ed25519, PKCS #8 PEM), generated once per checkout into the ignored
 * .data folder (the same file the app's non-production fallback uses). The production server
 * only signs with a key from the environment, so the scripts pass this one in as that setting;
 * a real deployment sets BANK_SIGNING_KEY itself (docs/bank-format.md).
 */
function localBankSigningKey() {
  const file = path.join(root, ".data", "bank-signing-key.pem");
  fs.mkdirSync(path.dirname(file), { recursive: true });
  if (!fs.existsSync(file)) {
    const pem = generateKeyPairSync("ed25519").privateKey.export({ format: "pem", type: "pkcs8" }).toString();
    try {
      fs.writeFileSync(file, pem, { mode: 0o600, flag: "wx" });
    } catch (e) {
      if (e?.code !== "EEXIST") throw e;
    }
  }
  return fs.readFileSync(file, "utf8");
}

/** The environment the app and its scripts run with; values already set win. */
export async function appEnv({ database = "loopkeeper", port = 3000 } = {}) {
  const { localUrl } = await import("./pg.mjs");
  return {
    ...process.env,
    DATABASE_URL: process.env.DATABASE_URL ?? localUrl(database),
    // Tests that stop and restart PostgreSQL only run against the private cluster.
    LOOPKEEPER_LOCAL_CLUSTER: process.env.DATABASE_URL ? "0" : "1",
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? localSecret(),
    BANK_SIGNING_KEY: process.env.BANK_SIGNING_KEY ?? localBankSigningKey(),
    NEXTAUTH_URL: process.env.NEXTAUTH_URL ?? `http://127.0.0.1:${port}`,
    // The demo maker's lab list, told when a build enters lab validation.
    LAB_MAIL_LIST: process.env.LAB_MAIL_LIST ?? "lab@tarnwell.example",
    PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: "1",
    NEXT_TELEMETRY_DISABLED: "1",
  };
}

export function run(cmd, args, env, label) {
  if (label) log(label);
  const r = spawnSync(cmd, args, { cwd: root, stdio: "inherit", env });
  if (r.status !== 0) fail(`${label ?? cmd} failed (exit ${r.status ?? r.signal}).`);
}

export async function prepare({ database = "loopkeeper", seed = true, port = 3000 } = {}) {
  ensureDependencies();
  const { up } = await import("./pg.mjs");
  up([database]);
  const env = await appEnv({ database, port });
  run("npx", ["tsx", "db/migrate.ts"], env, `Applying migrations to ${database}…`);
  if (seed) run("npx", ["tsx", "db/seed/index.ts"], env, "Seeding the demo data…");
  return env;
}

export function which(cmd) {
  try {
    execFileSync("sh", ["-c", `command -v ${cmd}`], { stdio: "pipe" });
    return true;
  } catch {
    return false;
  }
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  await prepare();
}
