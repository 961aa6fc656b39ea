import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EOF_RECORD, readIntelHex, recordChecksum, writeIntelHex } from "@/lib/engine";

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

  it("property: write → read round-trips at any base address", () => {
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 1, maxLength: 600 }), fc.integer({ min: 0, max: 0xfffff000 }), (data, base) => {
        const r = readIntelHex(writeIntelHex(data, base));
        expect(r.ok).toBe(true);
        expect(r.startAddress).toBe(base);
        expect(r.bytes).toEqual(data);
      }),
    );
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
