#!/usr/bin/env node
// CI step: a fresh clone under a directory only root can enter (a clone in /root/…, or any
// mode-0700 parent) must still get its PostgreSQL cluster, although the server itself runs
// as the postgres user. Clones this checkout's HEAD there, starts the cluster from the
// clone, connects as the app does, then stops and deletes it. Needs root (as a first run
// on a fresh machine does); otherwise says so and skips.
import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { fail, log } from "./log.mjs";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

/** A TCP port nobody listens on now, so the clone's cluster never meets the checkout's own. */
function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

export async function firstRunCheck() {
  if (process.getuid?.() !== 0) {
    log("Skipped the first-run check (clone under a mode-0700 directory as root): it needs root, and this run is not root.");
    return;
  }
  if (process.env.DATABASE_URL) {
    log("Skipped the first-run check: DATABASE_URL is set, so no local cluster is started.");
    return;
  }
  const parent = fs.mkdtempSync(path.join(os.homedir(), "loopkeeper-first-run-"));
  fs.chmodSync(parent, 0o700);
  const clone = path.join(parent, "loopkeeper");
  const env = { ...process.env, LOOPKEEPER_PG_PORT: String(await freePort()) };
  const pg = (...args) => spawnSync(process.execPath, [path.join(clone, "scripts/pg.mjs"), ...args], { cwd: clone, env, encoding: "utf8" });
  log(`First-run check: cloning into ${clone} (parent mode 0700) and starting its cluster on port ${env.LOOPKEEPER_PG_PORT}…`);
  try {
    execFileSync("git", ["clone", "--quiet", "--no-hardlinks", root, clone], { stdio: "inherit" });
    const up = pg("up");
    if (up.status !== 0) fail(`The cluster did not start from a clone under a 0700 directory:\n${up.stdout}${up.stderr}`);
    const check = pg("check");
    if (check.status !== 0) fail(`The clone's cluster started but the app's connection failed:\n${check.stdout}${check.stderr}`);
    const dataDir = check.stdout.trim();
    if (dataDir.startsWith(parent)) fail(`The clone's cluster runs inside ${parent}, which the postgres user cannot enter.`);
    log(`First-run check passed: the clone's cluster runs from ${dataDir}.`);
  } finally {
    const removed = pg("remove");
    if (removed.status !== 0) log(`Could not remove the clone's cluster: ${removed.stderr}`);
    fs.rmSync(parent, { recursive: true, force: true });
  }
}

if (process.argv[1] === fileURLToPath(import.meta.url)) await firstRunCheck();
