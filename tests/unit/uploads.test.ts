import { describe, expect, it } from "vitest";
import { importEventsIn, importPercent } from "@/lib/lots/import-events";
import { formatBytes } from "@/lib/units/bytes";
import { parseLotsCsv } from "@/lib/lots/csv";

describe("lots import progress lines", () => {
  it("reads complete lines only; a line cut by the network waits for its end", () => {
    const a = '{"type":"progress","phase":"checking","done":1000,"total":100000}\n{"type":"progress","pha';
    expect(importEventsIn(a)).toEqual([{ type: "progress", phase: "checking", done: 1000, total: 100000 }]);
    const b = `${a}se":"checking","done":2000,"total":100000}\n`;
    expect(importEventsIn(b).map((e) => (e.type === "progress" ? e.done : -1))).toEqual([1000, 2000]);
  });

  it("a preview is all checking; a commit is half checking, half writing", () => {
    expect(importPercent({ type: "progress", phase: "checking", done: 25_000, total: 100_000 }, true)).toBe(25);
    expect(importPercent({ type: "progress", phase: "checking", done: 100_000, total: 100_000 }, false)).toBe(50);
    expect(importPercent({ type: "progress", phase: "writing", done: 50_000, total: 100_000 }, false)).toBe(75);
    expect(importPercent({ type: "progress", phase: "writing", done: 100_000, total: 100_000 }, false)).toBe(100);
  });
});

describe("file sizes", () => {
  it("uses binary prefixes (IEC 80000-13:2008: 1 KiB = 1,024 B, 1 MiB = 1,048,576 B)", () => {
    expect(formatBytes(1023)).toBe("1,023 B");
    expect(formatBytes(1024)).toBe("1.0 KiB");
    expect(formatBytes(1536)).toBe("1.5 KiB");
    expect(formatBytes(16 * 1_048_576)).toBe("16.0 MiB");
  });
});

describe("lots CSV at factory size", () => {
  const HEADER = "lot_code,board_revision,build_version,serial_from,serial_to,produced_on,line";
  const serial = (n: number) => `TC1-${String(n).padStart(8, "0")}`;
  it("reads 100,000 rows and finds the one overlap among them, naming both rows", () => {
    const lines = [HEADER];
    for (let i = 0; i < 100_000; i++) lines.push(`B-${i},1.1.0,3.1.0,${serial(1_000_000 + i * 10)},${serial(1_000_000 + i * 10 + 9)},2025-06-02,L`);
    // Row 60,002 of the file (data row 60,001) reaches into the range of data row 12 (file row 13).
    lines[60_001] = `B-60000,1.1.0,3.1.0,${serial(1_000_000 + 11 * 10 + 5)},${serial(1_000_000 + 11 * 10 + 7)},2025-06-02,L`;
    const r = parseLotsCsv(lines.join("\n"));
    expect(r.rows.length).toBe(100_000);
    expect(r.issues).toEqual([{ row: 60_002, column: "serial_from", message: "Serials overlap lot B-11 on row 13 of this file." }]);
    // A file this size takes seconds on a loaded machine; the time is not what is tested.
  }, 120_000);
});
