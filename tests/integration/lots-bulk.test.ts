import { afterAll, describe, expect, it } from "vitest";
import { like, sql } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { productionLots } from "@/db/schema";
import { ImportCancelled, importLotsCsv, type ImportProgress } from "@/lib/use-cases/lots/import";

afterAll(closeDb);

const HEADER = "lot_code,board_revision,build_version,serial_from,serial_to,produced_on,line";
const serial = (n: number) => `TC1-${String(n).padStart(8, "0")}`;
const run = Date.now() % 100_000;

/**
 * The first serial of a free block: above every lot recorded from TC1-81000000 on (this file's
 * area up to TC1-91899999, clear of the demo lots and the other tests' ranges), so runs never overlap.
 */
async function freeBase(): Promise<number> {
  const res = await getDb().execute<{ top: string | null }>(
    sql`select max(serial_to) as top from production_lots where serial_from between 81000000 and 91899999 and board_model_id = (select id from board_models where serial_prefix = 'TC1')`,
  );
  return Math.max(81_000_000, Number(res.rows[0]?.top ?? 0) + 1);
}

/** One-board lots from `base`; `lastRow` replaces the file's last data row when given. */
function csv(tag: string, base: number, rows: number, lastRow?: string): string {
  const lines = [HEADER];
  for (let i = 0; i < rows; i++) lines.push(`${tag}-${i},1.1.0,3.1.0,${serial(base + i)},${serial(base + i)},2025-06-02,Line C`);
  if (lastRow) lines[lines.length - 1] = lastRow;
  return `${lines.join("\n")}\n`;
}

async function countLots(tag: string): Promise<number> {
  const [row] = await getDb().select({ n: sql<number>`count(*)::int` }).from(productionLots).where(like(productionLots.lotCode, `${tag}-%`));
  return Number(row?.n ?? 0);
}

describe("lots CSV import at factory size", () => {
  it("checks 100,000 rows against the database, and one row overlapping a recorded lot imports nothing", async () => {
    const db = getDb();
    const release = await demoActor("release@tarnwell.example");
    const tag = `IT${run}`;
    const base = await freeBase();
    // The last row reaches into demo lot TW-2501 (TC1-00010000 to TC1-00029999): only the database knows it is taken.
    const text = csv(tag, base, 100_000, `${tag}-last,1.1.0,3.1.0,${serial(29_990)},${serial(29_995)},2025-06-02,Line C`);
    const progress: ImportProgress[] = [];
    const r = await importLotsCsv(db, release, { csv: text, dryRun: false, onProgress: (p) => void progress.push(p) });
    expect(r.committed).toBe(0);
    expect(r.checked).toBe(100_000);
    expect(r.issues).toEqual([{ row: 100_001, column: "serial_from", message: expect.stringMatching(/overlap lot TW-2501/) }]);
    expect(await countLots(tag)).toBe(0);
    // Progress came per batch of rows, reaching every row checked.
    expect(progress.length).toBeGreaterThanOrEqual(100);
    expect(progress.at(-1)).toEqual({ phase: "checking", done: 100_000, total: 100_000 });
  }, 600_000);

  it("imports 100,000 good rows in one transaction, each with its audit event", async () => {
    const db = getDb();
    const release = await demoActor("release@tarnwell.example");
    const tag = `IG${run}`;
    const base = await freeBase();
    const phases = new Set<string>();
    const r = await importLotsCsv(db, release, { csv: csv(tag, base, 100_000), dryRun: false, onProgress: (p) => void phases.add(p.phase) });
    expect(r).toMatchObject({ committed: 100_000, checked: 100_000, issues: [] });
    expect([...phases]).toEqual(["checking", "writing"]);
    expect(await countLots(tag)).toBe(100_000);
    // Through the (entity_type, entity_id) index: one lookup per lot. The tables just grew by
    // 100,000 rows each; fresh statistics let the planner see that before it picks the plan.
    await db.execute(sql`analyze production_lots, audit_events`);
    const audit = await db.execute<{ n: number }>(
      sql`select count(*)::int as n from production_lots p where p.lot_code like ${`${tag}-%`} and exists (select 1 from audit_events a where a.entity_type = 'production_lot' and a.entity_id = p.id::text and a.action = 'lot.import')`,
    );
    expect(Number(audit.rows[0]?.n)).toBe(100_000);
  }, 600_000);

  it("a cancel between batches rolls everything back, even while writing", async () => {
    const db = getDb();
    const release = await demoActor("release@tarnwell.example");
    const tag = `IC${run}`;
    const base = await freeBase();
    const cancel = new AbortController();
    const run_ = importLotsCsv(db, release, {
      csv: csv(tag, base, 5_000),
      dryRun: false,
      signal: cancel.signal,
      // The client goes away once the first batch is written.
      onProgress: (p) => {
        if (p.phase === "writing") cancel.abort();
      },
    });
    await expect(run_).rejects.toBeInstanceOf(ImportCancelled);
    expect(await countLots(tag)).toBe(0);
  }, 300_000);
});
