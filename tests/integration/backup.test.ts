import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { Client } from "pg";

const sourceUrl = process.env.DATABASE_URL!;
const restoredName = `loopkeeper_restore_${process.pid}_${Date.now()}`;
const restoredUrl = (() => {
  const u = new URL(sourceUrl);
  u.pathname = `/${restoredName}`;
  return u.toString();
})();

async function snapshot(url: string) {
  const c = new Client({ connectionString: url });
  await c.connect();
  try {
    const tables = (await c.query<{ table_name: string }>("select table_name from information_schema.tables where table_schema='public' and table_type='BASE TABLE' order by 1")).rows.map((r) => r.table_name);
    const counts: Record<string, number> = {};
    for (const t of tables) counts[t] = Number((await c.query<{ n: string }>(`select count(*) as n from "${t}"`)).rows[0]!.n);
    // One checksum over every profile version's document, in a stable order.
    const docs = await c.query<{ md5: string | null }>("select md5(string_agg(id::text || ':' || document::text, ',' order by id)) as md5 from profile_versions");
    return { counts, documentsMd5: docs.rows[0]!.md5 };
  } finally {
    await c.end();
  }
}

afterAll(async () => {
  const admin = new URL(sourceUrl);
  admin.pathname = "/postgres";
  const c = new Client({ connectionString: admin.toString() });
  await c.connect();
  await c.query(`drop database if exists "${restoredName}"`);
  await c.end();
});

describe("backup and restore", () => {
  it("restores the demo into an empty database with the same rows and documents", async () => {
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "lk-backup-")), "demo.dump");
    const env = { ...process.env, DATABASE_URL: sourceUrl };
    execFileSync("node", ["scripts/db-backup.mjs", "backup", file], { env, stdio: "pipe" });
    expect(fs.statSync(file).size).toBeGreaterThan(1000);
    execFileSync("node", ["scripts/db-backup.mjs", "restore", file, "--database", restoredName], { env, stdio: "pipe" });
    const [before, after] = [await snapshot(sourceUrl), await snapshot(restoredUrl)];
    expect(Object.keys(after.counts).length).toBeGreaterThan(10);
    expect(after).toEqual(before);
    expect(before.counts.users).toBeGreaterThanOrEqual(7);
  });

  it("refuses to restore over a database that has tables", () => {
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "lk-backup-")), "again.dump");
    const env = { ...process.env, DATABASE_URL: sourceUrl };
    execFileSync("node", ["scripts/db-backup.mjs", "backup", file], { env, stdio: "pipe" });
    let message = "";
    try {
      execFileSync("node", ["scripts/db-backup.mjs", "restore", file], { env, stdio: "pipe" });
    } catch (err) {
      message = String((err as { stderr?: Buffer }).stderr ?? "");
    }
    expect(message).toMatch(/not empty/);
  });
});
