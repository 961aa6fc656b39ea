import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EOF_RECORD, readIntelHex, recordChecksum, writeIntelHex } from "@/lib/engine";
import { formatRecord, RECORD_DATA } from "@/lib/hex/record";

const recordBytes = (rec: string): number[] => (rec.slice(1).match(/../g) ?? []).map((h) => parseInt(h, 16));

describe("Intel HEX", () => {
  it("the worked data record sums to 0 and reads as 16 bytes at 0x2462", () => {
    // Intel, "Hexadecimal Object File Format Specification", Rev. A, 1988 (worked record from a compiler vendor's manual of that format).
    const rec = ":10246200464C5549442050524F46494C4500464C33";
    expect(recordBytes(rec).reduce((s, b) => (s + b) & 0xff, 0)).toBe(0);
    expect(recordChecksum(recordBytes(rec).slice(0, -1))).toBe(0x33);
    const r = readIntelHex(`${rec}\n${EOF_RECORD}\n`);
    expect(r.ok).toBe(true);
    expect(r.startAddress).toBe(0x2462);
    expect(new TextDecoder().decode(r.bytes.subarray(0, 15))).toBe("FLUID PROFILE\0F");
  });

  it("the end-of-file record is :00000001FF", () => {
    // Intel, "Hexadecimal Object File Format Specification", Rev. A: end-of-file record.
    expect(EOF_RECORD).toBe(":00000001FF");
    expect(recordChecksum([0, 0, 0, 1])).toBe(0xff);
  });

  it("writes a type-04 record at the base address, 16-byte data records, then EOF", () => {
    const data = Uint8Array.from({ length: 40 }, (_, i) => i);
    const text = writeIntelHex(data, 0x0801f800);
    const lines = text.trim().split("\n");
    expect(lines[0]).toBe(":020000040801F1");
    expect(lines[1]!.startsWith(":10F80000")).toBe(true);
    expect(lines[3]!.startsWith(":08F82000")).toBe(true);
    expect(lines.at(-1)).toBe(EOF_RECORD);
    for (const l of lines) expect(recordBytes(l).reduce((s, b) => (s + b) & 0xff, 0)).toBe(0);
  });

  it("starts a new type-04 record when data crosses a 64 KiB boundary", () => {
    const data = Uint8Array.from({ length: 64 }, (_, i) => 255 - i);
    const text = writeIntelHex(data, 0x0001ffe0);
    expect(text).toContain(":020000040002F8");
    const r = readIntelHex(text);
    expect(r.ok).toBe(true);
    expect(r.startAddress).toBe(0x0001ffe0);
    expect(Array.from(r.bytes)).toEqual(Array.from(data));
  });

  it("reads type-02 extended segment addresses (base = value × 16)", () => {
    const text = [":020000021000EC", ":0400000001020304F2", EOF_RECORD].join("\n");
    const r = readIntelHex(text);
    expect(r.errors).toEqual([]);
    expect(r.startAddress).toBe(0x10000);
    expect(Array.from(r.bytes)).toEqual([1, 2, 3, 4]);
  });

  it("property: write → read round-trips at any base address, for images of hundreds of bytes and many records", () => {
    let largestBytes = 0;
    let mostRecords = 0;
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 1, maxLength: 2048, size: "max" }), fc.integer({ min: 0, max: 0xfffff000 }), (data, base) => {
        const r = readIntelHex(writeIntelHex(data, base));
        expect(r.ok).toBe(true);
        expect(r.startAddress).toBe(base);
        expect(r.bytes).toEqual(data);
        largestBytes = Math.max(largestBytes, data.length);
        mostRecords = Math.max(mostRecords, r.recordCount);
      }),
      { numRuns: 200 },
    );
    // The generator really reached realistic sizes (fast-check's default size would stay near 10 bytes).
    expect(largestBytes).toBeGreaterThanOrEqual(500);
    expect(mostRecords).toBeGreaterThanOrEqual(32);
  }, 120_000);

  it("property: a data record repeated or moved onto another's address is refused, naming both lines", () => {
    let mostLines = 0;
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 64, maxLength: 1024, size: "max" }), fc.nat(), fc.nat(), fc.integer({ min: -8, max: 8 }), (data, pick, put, shift) => {
        const lines = writeIntelHex(data, 0x8000).trim().split("\n");
        mostLines = Math.max(mostLines, lines.length);
        // Line 1 is the address record, the last is end-of-file: data records lie between.
        const dataLines = lines.length - 2;
        const from = 1 + (pick % dataLines);
        const bytes = recordBytes(lines[from]!);
        const payload = bytes.slice(4, -1);
        // Shifted by less than its own length, the copy always overlaps the original record.
        const address = Math.max(0, ((bytes[1]! << 8) | bytes[2]!) + (shift % payload.length));
        const copy = formatRecord(RECORD_DATA, address, payload);
        const at = 1 + (put % (dataLines + 1));
        lines.splice(at, 0, copy);
        const r = readIntelHex(lines.join("\n"));
        expect(r.ok).toBe(false);
        const overlap = r.errors.find((e) => e.code === "hex.overlap");
        expect(overlap).toBeDefined();
        const named = [...overlap!.message.matchAll(/Lines (\d+) and (\d+)/g)].flatMap((m) => [Number(m[1]), Number(m[2])]);
        expect(named).toContain(at + 1);
      }),
      { numRuns: 300 },
    );
    expect(mostLines).toBeGreaterThanOrEqual(40);
  }, 120_000);

  it("refuses two records for one address, naming both lines", () => {
    const text = [":020000040000FA", ":0400100001020304E2", ":0400100005060708D2", EOF_RECORD].join("\n");
    const r = readIntelHex(text);
    expect(r.ok).toBe(false);
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]).toMatchObject({ code: "hex.overlap", line: 3 });
    expect(r.errors[0]!.message).toMatch(/^Lines 2 and 3 both write address 0x00000010–0x00000013/);
    // A partial overlap names the one shared byte.
    const partial = readIntelHex([":0400100001020304E2", ":0200130009AA38", EOF_RECORD].join("\n"));
    expect(partial.errors.map((e) => e.code)).toEqual(["hex.overlap"]);
    expect(partial.errors[0]!.message).toMatch(/^Lines 1 and 2 both write address 0x00000013;/);
  });

  it("refuses an end-of-file record with data, anything after it, and address records of the wrong length", () => {
    const codes = (t: string) => readIntelHex(t).errors.map((e) => `${e.code}@${e.line}`);
    // ":01000001AA54" is an end-of-file record carrying one byte (0x01+0x01+0xAA+0x54 = 0x100).
    expect(codes(":0100000001FE\n:01000001AA54")).toEqual(["hex.bad_eof@2"]);
    expect(codes(":0100000001FE\n:00000001FF\n:0100100002ED")).toEqual(["hex.after_eof@3"]);
    expect(codes(":0100000001FE\n:00000001FF\ngarbage")).toEqual(["hex.after_eof@3"]);
    // Extended linear address with 1 and 3 data bytes.
    expect(codes(":0100000400FB\n:0100000001FE\n:00000001FF")).toEqual(["hex.bad_length@1"]);
    expect(codes(":030000040000F009\n:0100000001FE\n:00000001FF")).toEqual(["hex.bad_length@1"]);
    // Extended segment address with 1 byte; start records with 2 bytes.
    expect(codes(":0100000210ED\n:0100000001FE\n:00000001FF")).toEqual(["hex.bad_length@1"]);
    expect(codes(":0100000001FE\n:020000050000F9\n:00000001FF")).toEqual(["hex.bad_length@2"]);
  });

  it("reports start-address records 03 and 05 without placing data", () => {
    // Type 03: CS = 0x1234, IP = 0x5678; type 05: EIP = 0x08000135 (checksums worked by hand: bytes sum to 0 mod 256).
    const r = readIntelHex([":0100000001FE", ":0400000312345678E5", ":0400000508000135B9", EOF_RECORD].join("\n"));
    expect(r.errors).toEqual([]);
    expect(r.ok).toBe(true);
    expect(Array.from(r.bytes)).toEqual([1]);
    expect(r.startRecords).toEqual([
      { line: 2, type: 3, segment: 0x1234, offset: 0x5678 },
      { line: 3, type: 5, linearAddress: 0x08000135 },
    ]);
  });

  it("reports the line of a record with a bad checksum", () => {
    const lines = writeIntelHex(Uint8Array.from({ length: 48 }, (_, i) => i), 0x1000).trim().split("\n");
    lines[2] = `${lines[2]!.slice(0, -2)}00`;
    const r = readIntelHex(lines.join("\n"));
    expect(r.ok).toBe(false);
    expect(r.errors[0]).toMatchObject({ code: "hex.bad_checksum", line: 3 });
    expect(r.errors[0]!.message).toMatch(/^Line 3: checksum 0x00 is wrong/);
  });

  it("reports other malformed records by line", () => {
    const codes = (t: string) => readIntelHex(t).errors.map((e) => `${e.code}@${e.line}`);
    expect(codes("hello\n:00000001FF")).toEqual(["hex.no_start_code@1"]);
    expect(codes(":0Z\n:00000001FF")).toEqual(["hex.bad_characters@1"]);
    expect(codes(":0500000001FA\n:00000001FF")).toEqual(["hex.bad_length@1"]);
    expect(codes(":0100000001FE")[0]).toBe("hex.no_eof@1");
    expect(codes(":00000001FF\n:0100000001FE")).toEqual(["hex.after_eof@2"]);
    expect(codes(":00000006FA\n:00000001FF")).toEqual(["hex.unknown_type@1"]);
  });

  it("property: the reader never throws on random text", () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 300 }), (t) => {
        expect(() => readIntelHex(t)).not.toThrow();
      }),
      { numRuns: 1000 },
    );
    const hexish = fc.array(fc.constantFrom(..."0123456789ABCDEF:\n"), { maxLength: 400 }).map((c) => c.join(""));
    fc.assert(fc.property(hexish, (t) => void readIntelHex(t)), { numRuns: 2000 });
    expect(readIntelHex(42 as unknown as string).errors[0]!.code).toBe("hex.not_text");
  });

  it("refuses data that would run past 0xFFFFFFFF", () => {
    expect(() => writeIntelHex(new Uint8Array(32), 0xfffffff0)).toThrow(/baseAddress/);
    expect(() => writeIntelHex(new Uint8Array(1), -1)).toThrow(/baseAddress/);
  });
});
