import { Client } from "pg";

/** The lots CSV header in the documented column order. */
export const LOTS_CSV_HEADER = "lot_code,board_revision,build_version,serial_from,serial_to,produced_on,line";

/** A TC-1 serial as the factory prints it (prefix, dash, 8 digits). */
export const tc1Serial = (n: number): string => `TC1-${String(n).padStart(8, "0")}`;

/**
 * A lots CSV of one-board lots `${tag}-0`, `${tag}-1`, … from serial `base` on, for TC-1 revision
 * 1.1.0 and demo build 3.1.0 (at production in the demo data). All rows are valid unless `badRow`
 * (a 1-based data row) is given: that row's last serial is then below its first.
 */
export function bulkLotsCsv(tag: string, base: number, rows: number, { badRow }: { badRow?: number } = {}): string {
  const lines = [LOTS_CSV_HEADER];
  for (let i = 0; i < rows; i++) {
    const n = base + i;
    lines.push(`${tag}-${i},1.1.0,3.1.0,${tc1Serial(n)},${tc1Serial(i + 1 === badRow ? n - 1 : n)},2025-06-02,Line C`);
  }
  return `${lines.join("\n")}\n`;
}

/** Runs `work` with a connection to the test database (the one the app under test uses). */
export async function withTestDb<T>(work: (db: Client) => Promise<T>): Promise<T> {
  const db = new Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    return await work(db);
  } finally {
    await db.end();
  }
}

/**
 * The first TC-1 serial of a free block inside [from, to]: above every lot recorded there, so a
 * run never overlaps what an earlier (interrupted) run left behind.
 */
export async function freeTc1Base(from: number, to: number): Promise<number> {
  return withTestDb(async (db) => {
    const r = await db.query<{ top: string | null }>(
      `select max(serial_to) as top from production_lots where serial_from between $1 and $2 and board_model_id = (select id from board_models where serial_prefix = 'TC1')`,
      [from, to],
    );
    return Math.max(from, Number(r.rows[0]?.top ?? 0) + 1);
  });
}

/** How many lots have a code starting `${tag}-`, counted in the database. */
export async function countLotsTagged(tag: string): Promise<number> {
  return withTestDb(async (db) => Number((await db.query<{ n: number }>(`select count(*)::int as n from production_lots where lot_code like $1`, [`${tag}-%`])).rows[0]?.n ?? 0));
}

/**
 * Deletes the lots a test recorded (codes starting `${tag}-`), so the lists, counts and lookups
 * other specs read are as the demo data left them. Their audit events stay: the log is append-only.
 */
export async function deleteLotsTagged(tag: string): Promise<number> {
  return withTestDb(async (db) => (await db.query(`delete from production_lots where lot_code like $1`, [`${tag}-%`])).rowCount ?? 0);
}
