import { describe, expect, it } from "vitest";
import { splitCsv } from "@/lib/csv/read";
import { parseLotsCsv } from "@/lib/lots/csv";

// CSV quoting rules: RFC 4180 §2 (fields with commas, quotes and line breaks are
// double-quoted; a quote inside is doubled).
describe("lots CSV", () => {
  const header = "lot_code,board_revision,build_version,serial_from,serial_to,produced_on,line";
  it("splits quoted fields with commas, quotes and newlines (RFC 4180 §2)", () => {
    expect(splitCsv('a,"b,c","d""e"\r\n"f\ng",h\n')).toEqual([
      { line: 1, fields: ["a", "b,c", 'd"e'] },
      { line: 2, fields: ["f\ng", "h"] },
    ]);
  });
  it("parses good rows with their line numbers", () => {
    const r = parseLotsCsv(`${header}\nL1,1.1.0,3.0.0,TC1-00000001,TC1-00000100,2025-02-03,A\nL2,1.1.0,3.0.0,TC1-00000101,TC1-00000200,2025-02-03,A\n`);
    expect(r.issues).toEqual([]);
    expect(r.rows.map((x) => x.row)).toEqual([2, 3]);
  });
  it("lists row, column and message of a bad row", () => {
    const r = parseLotsCsv(`${header}\nL1,1.1.0,3.0.0,TC1-00000001,TC1-00000100,2025-02-03,A\nL2,1.1.0,3.0.0,TC1-00000200,TC1-0000010x,2025-13-03,A\n`);
    expect(r.issues.map((i) => [i.row, i.column])).toEqual([
      [3, "serial_to"],
      [3, "produced_on"],
    ]);
  });
  it("reports overlaps and repeated lot codes within the file", () => {
    const r = parseLotsCsv(`${header}\nL1,1.1.0,3.0.0,TC1-00000001,TC1-00000100,2025-02-03,A\nL1,1.1.0,3.0.0,TC1-00000100,TC1-00000300,2025-02-03,A\n`);
    expect(r.issues.map((i) => [i.row, i.column])).toEqual([
      [3, "lot_code"],
      [3, "serial_from"],
    ]);
  });
  it("refuses a header with a missing column", () => {
    const r = parseLotsCsv("lot_code,board_revision\nL1,1.1.0\n");
    expect(r.issues[0]).toMatchObject({ row: 1, column: "build_version" });
  });
});
