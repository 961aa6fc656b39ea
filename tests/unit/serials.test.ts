import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { formatSerial, parseSerial, rangesOverlap, serialCount } from "@/lib/serials/serial";

// Format defined in docs/serials.md (the product's own serial format).
describe("serial numbers", () => {
  it("parses the canonical form", () => {
    expect(parseSerial("TC1-00012345")).toEqual({ ok: true, serial: { prefix: "TC1", number: 12345 } });
  });
  it("forgives case, spaces and missing leading zeros", () => {
    expect(parseSerial("  tc1-12345 ")).toEqual({ ok: true, serial: { prefix: "TC1", number: 12345 } });
  });
  it.each(["", "TC1", "TC1-", "TC1-123456789", "1TC-0001", "TC1_00000001", "TC1-12a4", "T-0001", "TC1--1"])("refuses %j", (text) => {
    const r = parseSerial(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/not a serial number/);
  });
  it("formats with 8 zero-padded digits", () => {
    expect(formatSerial("TC1", 12345)).toBe("TC1-00012345");
    expect(formatSerial("TCX", 99_999_999)).toBe("TCX-99999999");
  });
  it("refuses numbers and prefixes out of range", () => {
    expect(() => formatSerial("TC1", 100_000_000)).toThrow(RangeError);
    expect(() => formatSerial("TC1", -1)).toThrow(RangeError);
    expect(() => formatSerial("tc1", 1)).toThrow(RangeError);
  });
  it("round-trips any valid serial", () => {
    fc.assert(
      fc.property(fc.stringMatching(/^[A-Z][A-Z0-9]{1,7}$/), fc.integer({ min: 0, max: 99_999_999 }), (prefix, n) => {
        const r = parseSerial(formatSerial(prefix, n));
        return r.ok && r.serial.prefix === prefix && r.serial.number === n;
      }),
    );
  });
  it("counts inclusive ranges and detects overlap at the edges", () => {
    expect(serialCount(10, 19)).toBe(10);
    expect(rangesOverlap(1, 10, 10, 20)).toBe(true);
    expect(rangesOverlap(1, 10, 11, 20)).toBe(false);
    expect(rangesOverlap(5, 6, 1, 100)).toBe(true);
  });
});
