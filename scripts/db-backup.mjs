#!/usr/bin/env node
// `npm run db:backup [file]`: a pg_dump custom-format archive of the app's database.
// `npm run db:restore <file> [--database name]`: restores an archive into an EMPTY database.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import pg from "pg";
import { log, fail } from "./log.mjs";
import { localUrl, pgBin, up } from "./pg.mjs";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

function targetUrl(database) {
  if (database) {
    const base = new URL(process.env.DATABASE_URL ?? localUrl("loopkeeper"));
    base.pathname = `/${database}`;
    return base.toString();
  }
  return process.env.DATABASE_URL ?? localUrl("loopkeeper");
}

export function backup(file, url = targetUrl()) {
  const out = path.resolve(file ?? path.join(root, ".data", "backups", `loopkeeper-${new Date().toISOString().replace(/[:.]/g, "-")}.dump`));
  fs.mkdirSync(path.dirname(out), { recursive: true });
  const r = spawnSync(pgBin("pg_dump"), ["--format=custom", "--no-owner", "--no-privileges", `--file=${out}`, url], { encoding: "utf8" });
  if (r.status !== 0) fail(`pg_dump failed: ${r.stderr.trim()}`);
  log(`Backup written to ${path.relative(process.cwd(), out) || out} (${fs.statSync(out).size} bytes).`);
  return out;
}

async function ensureEmptyDatabase(url) {
  const target = new URL(url);
  const name = decodeURIComponent(target.pathname.slice(1));
  const admin = new URL(url);
  admin.pathname = "/postgres";
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    const exists = await client.query("select 1 from pg_database where datname = $1", [name]);
    if (exists.rowCount === 0) {
      await client.query(`create database "${name.replace(/"/g, '""')}"`);
      return;
    }
  } finally {
    await client.end();
  }
  const db = new pg.Client({ connectionString: url });
  await db.connect();
  try {
    const tables = await db.query("select count(*)::int as n from information_schema.tables where table_schema = 'public'");
    if (tables.rows[0].n > 0) fail(`Database ${name} is not empty; restore only into an empty database (or a new name with --database).`);
  } finally {
    await db.end();
  }
}

export async function restore(file, url = targetUrl()) {
  if (!file || !fs.existsSync(file)) fail(`Give the archive to restore: npm run db:restore -- <file> [--database name]`);
  await ensureEmptyDatabase(url);
  const r = spawnSync(pgBin("pg_restore"), ["--no-owner", "--no-privileges", "--exit-on-error", "--single-transaction", `--dbname=${url}`, file], { encoding: "utf8" });
  if (r.status !== 0) fail(`pg_restore failed: ${r.stderr.trim()}`);
  log(`Restored ${path.basename(file)} into ${new URL(url).pathname.slice(1)}.`);
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const [cmd, ...rest] = process.argv.slice(2);
  const dbFlag = rest.indexOf("--database");
  const database = dbFlag >= 0 ? rest[dbFlag + 1] : undefined;
  const positional = dbFlag >= 0 ? rest.filter((_, i) => i !== dbFlag && i !== dbFlag + 1) : rest;
  if (!process.env.DATABASE_URL) up(["loopkeeper"]);
  if (cmd === "backup") backup(positional[0], targetUrl(database));
  else if (cmd === "restore") await restore(positional[0], targetUrl(database));
  else fail("Usage: node scripts/db-backup.mjs backup [file] | restore <file> [--database name]");
}
