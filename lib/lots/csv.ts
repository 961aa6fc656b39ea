import { LOT_CSV_COLUMNS, lotInput, type LotInput } from "./input";
import { parseSerial, rangesOverlap } from "../serials/serial";
import { unsafeTextReason } from "../validation/text";
import { splitCsv, withoutBom } from "../csv/read";

/** A problem in one cell or row of an uploaded lots CSV; row 1 is the header. */
export interface CsvRowIssue {
  row: number;
  column: string;
  message: string;
}

export interface ParsedLotRow {
  row: number;
  lot: LotInput;
}

export interface ParsedLotsCsv {
  rows: ParsedLotRow[];
  issues: CsvRowIssue[];
}

export const MAX_CSV_ROWS = 100_000;

/**
 * Reads a lots CSV: a header naming the seven columns (any order), then one lot per
 * row. Each row is checked with the same schema as the form and the API; rows whose
 * serial ranges overlap each other are reported too. Nothing is looked up here: the
 * database checks (board, build stage, existing lots) run in the dry run and commit.
 */
export function parseLotsCsv(text: string): ParsedLotsCsv {
  const issues: CsvRowIssue[] = [];
  const records = splitCsv(withoutBom(text));
  const header = records.shift();
  if (!header) return { rows: [], issues: [{ row: 1, column: "", message: "The file is empty; the first row must name the columns." }] };
  const names = header.fields.map((f) => f.trim().toLowerCase());
  const index = new Map<string, number>();
  for (const [col] of LOT_CSV_COLUMNS) {
    const at = names.indexOf(col);
    if (at < 0) issues.push({ row: header.line, column: col, message: `The header has no "${col}" column. Expected: ${LOT_CSV_COLUMNS.map(([c]) => c).join(",")}.` });
    else index.set(col, at);
  }
  const unknown = names.filter((n) => n && !LOT_CSV_COLUMNS.some(([c]) => c === n));
  if (unknown.length) issues.push({ row: header.line, column: unknown[0]!, message: `Unknown column(s): ${unknown.join(", ")}. Remove them.` });
  if (issues.length) return { rows: [], issues };
  if (records.length > MAX_CSV_ROWS) return { rows: [], issues: [{ row: 1, column: "", message: `The file has ${records.length} lots; import at most ${MAX_CSV_ROWS} at a time.` }] };
  if (records.length === 0) return { rows: [], issues: [{ row: 2, column: "", message: "The file has a header but no lots." }] };

  const rows: ParsedLotRow[] = [];
  for (const rec of records) {
    if (rec.fields.length !== names.length) {
      issues.push({ row: rec.line, column: "", message: `Row has ${rec.fields.length} values; the header has ${names.length}.` });
      continue;
    }
    // The same character rules as every other way in: the dry run and the commit read the file
    // with this one parser, so a cell the database could not store is refused by both.
    const unsafe = LOT_CSV_COLUMNS.map(([col]) => ({ col, reason: unsafeTextReason(rec.fields[index.get(col)!] ?? "", { singleLine: true }) })).filter((u) => u.reason);
    if (unsafe.length) {
      for (const u of unsafe) issues.push({ row: rec.line, column: u.col, message: u.reason! });
      continue;
    }
    const raw = Object.fromEntries(LOT_CSV_COLUMNS.map(([col, key]) => [key, rec.fields[index.get(col)!] ?? ""]));
    const r = lotInput.safeParse(raw);
    if (!r.success) {
      for (const issue of r.error.issues) {
        const key = String(issue.path[0] ?? "");
        const col = LOT_CSV_COLUMNS.find(([, k]) => k === key)?.[0] ?? "";
        issues.push({ row: rec.line, column: col, message: issue.message });
      }
      continue;
    }
    rows.push({ row: rec.line, lot: r.data });
  }
  issues.push(...duplicateIssues(rows));
  issues.sort((a, b) => a.row - b.row);
  return { rows, issues };
}

/**
 * Lot codes repeated and serial ranges overlapping within the file itself. Ranges are sorted
 * by prefix and first serial and each is compared with the furthest-reaching range before
 * it, so a file of 100,000 lots is checked in n log n, not n².
 */
function duplicateIssues(rows: ParsedLotRow[]): CsvRowIssue[] {
  const issues: CsvRowIssue[] = [];
  const codes = new Map<string, number>();
  const ranges: { row: number; prefix: string; from: number; to: number; code: string }[] = [];
  for (const { row, lot } of rows) {
    const seen = codes.get(lot.lotCode);
    if (seen !== undefined) issues.push({ row, column: "lot_code", message: `Lot code ${lot.lotCode} is already used on row ${seen} of this file.` });
    else codes.set(lot.lotCode, row);
    const from = parseSerial(lot.serialFrom);
    const to = parseSerial(lot.serialTo);
    if (from.ok && to.ok) ranges.push({ row, prefix: from.serial.prefix, from: from.serial.number, to: to.serial.number, code: lot.lotCode });
  }
  ranges.sort((a, b) => (a.prefix < b.prefix ? -1 : a.prefix > b.prefix ? 1 : a.from - b.from || a.row - b.row));
  let reach: (typeof ranges)[number] | undefined;
  for (const r of ranges) {
    if (reach && reach.prefix === r.prefix && rangesOverlap(reach.from, reach.to, r.from, r.to)) {
      // Reported on the later row of the two, naming the earlier, as a reader goes down the file.
      const [earlier, later] = reach.row < r.row ? [reach, r] : [r, reach];
      issues.push({ row: later.row, column: "serial_from", message: `Serials overlap lot ${earlier.code} on row ${earlier.row} of this file.` });
    }
    if (!reach || reach.prefix !== r.prefix || r.to > reach.to) reach = r;
  }
  return issues;
}
