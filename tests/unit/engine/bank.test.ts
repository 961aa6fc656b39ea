import zlib from "node:zlib";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { bankBytes, contentHashHex, decodeBank, encodeBank, quantise, readIntelHex, writeIntelHex, type CoolingProfile, type ProfileSettings } from "@/lib/engine";
import { demoBankImages } from "./demo-images";
import { anyInRangeProfileArb, performanceProfile, quietProfile, validProfileArb } from "./fixtures";

const settingsOf = (p: CoolingProfile): ProfileSettings => {
  const { criticalTempC, sensorLossDutyPct, pump, fans } = p;
  return { criticalTempC, sensorLossDutyPct, pump, fans };
};

const encodeOk = (slots: Parameters<typeof encodeBank>[0]): Uint8Array => {
  const r = encodeBank(slots);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.bytes;
};

describe("bank image", () => {
  it("lays out header, slots and a little-endian CRC-32 of all bytes before it", () => {
    const bytes = encodeOk([{ profile: quietProfile(), version: "1.2.3" }, { profile: performanceProfile(), version: "2.0.0" }]);
    expect(Array.from(bytes.subarray(0, 4))).toEqual([0x4c, 0x4b, 0x50, 0x42]);
    expect(bytes[4]).toBe(1);
    expect(bytes[5]).toBe(2);
    expect(bytes[6]! | (bytes[7]! << 8)).toBe(bytes.length);
    expect(bytes.length).toBe(bankBytes([{ pumpPoints: 4, fanPoints: 4 }, { pumpPoints: 3, fanPoints: 4 }]));
    // CRC-32 as zlib computes it (Greg Cook, reveng catalogue: CRC-32/ISO-HDLC).
    const stored = new DataView(bytes.buffer, bytes.byteOffset).getUint32(bytes.length - 4, true);
    expect(stored).toBe(zlib.crc32(bytes.subarray(0, bytes.length - 4)));
  });

  it("stores the first 8 bytes of the content hash and the version bytes", () => {
    const profile = quietProfile();
    const bytes = encodeOk([{ profile, version: "3.14.255" }]);
    const decoded = decodeBank(bytes);
    expect(decoded.ok).toBe(true);
    expect(decoded.slots[0]!.contentHashPrefix).toBe(contentHashHex(profile).slice(0, 16));
    expect(decoded.slots[0]!.version).toBe("3.14.255");
  });

  it("decodes what it encodes for the example profiles", () => {
    const q = quantise(quietProfile());
    const d = decodeBank(encodeOk([{ profile: q, version: "1.0.0" }]));
    expect(d.slots[0]!.settings).toEqual(settingsOf(q));
  });

  it("quantises toward more cooling", () => {
    const p = quietProfile();
    p.pump.points[1] = { tempC: 35.3, dutyPct: 50.1 };
    p.criticalTempC = 59.9;
    const q = quantise(p);
    expect(q.pump.points[1]).toEqual({ tempC: 35, dutyPct: 50.5 });
    expect(q.criticalTempC).toBe(59.5);
    expect(q.name).toBe(p.name);
  });

  it("property: encode → decode is the identity on quantised profiles", () => {
    fc.assert(
      fc.property(fc.array(anyInRangeProfileArb, { minLength: 1, maxLength: 4 }), fc.array(fc.tuple(fc.nat(255), fc.nat(255), fc.nat(255)), { minLength: 4, maxLength: 4 }), (profiles, versions) => {
        const slots = profiles.map((p, i) => ({ profile: quantise(p), version: versions[i]!.join(".") }));
        const d = decodeBank(encodeOk(slots));
        expect(d.errors).toEqual([]);
        expect(d.slots.map((s) => s.settings)).toEqual(slots.map((s) => settingsOf(s.profile)));
        expect(d.slots.map((s) => s.version)).toEqual(slots.map((s) => s.version));
        // Quantising twice changes nothing.
        for (const s of slots) expect(quantise(s.profile)).toEqual(s.profile);
      }),
      { numRuns: 200 },
    );
  });

  it("reports bad magic, truncation and CRC mismatch with expected and actual", () => {
    const bytes = encodeOk([{ profile: quietProfile(), version: "1.0.0" }]);
    const badMagic = bytes.slice();
    badMagic[0] = 0x00;
    expect(decodeBank(badMagic).errors[0]!.code).toBe("bank.bad_magic");

    const truncated = decodeBank(bytes.subarray(0, bytes.length - 6));
    expect(truncated.ok).toBe(false);
    expect(truncated.errors[0]).toMatchObject({ code: "bank.truncated", expected: bytes.length, actual: bytes.length - 6 });

    const flipped = bytes.slice();
    flipped[20] = flipped[20]! ^ 0x01;
    const d = decodeBank(flipped);
    const crcError = d.errors.find((e) => e.code === "bank.crc_mismatch")!;
    expect(crcError.expected).toBe(zlib.crc32(bytes.subarray(0, bytes.length - 4)));
    expect(crcError.actual).toBe(zlib.crc32(flipped.subarray(0, flipped.length - 4)));
    expect(d.ok).toBe(false);
  });

  it("reads a memory dump with erased bytes after the image", () => {
    const bytes = encodeOk([{ profile: quietProfile(), version: "1.0.0" }]);
    const dump = new Uint8Array(256).fill(0xff);
    dump.set(bytes);
    expect(decodeBank(dump).ok).toBe(true);
  });

  it("refuses what it cannot encode, with errors not exceptions", () => {
    const p = quietProfile();
    const bad = (slots: Parameters<typeof encodeBank>[0], opts?: Parameters<typeof encodeBank>[1]) => {
      const r = encodeBank(slots, opts);
      expect(r.ok).toBe(false);
      return r.ok ? [] : r.errors.map((e) => e.code);
    };
    expect(bad([])).toContain("bank.no_slots");
    expect(bad([{ profile: p, version: "1.0.0-rc.1" }])).toContain("bank.version_not_encodable");
    expect(bad([{ profile: p, version: "256.0.0" }])).toContain("bank.version_not_encodable");
    expect(bad([{ profile: p, version: "1.0.0", contentHashHex: "xyz" }])).toContain("bank.bad_content_hash");
    expect(bad([{ profile: p, version: "1.0.0" }], { memoryBytes: 20 })).toContain("bank.exceeds_memory");
    expect(bad([{ profile: p, version: "1.0.0" }, { profile: p, version: "1.0.1" }], { slotCount: 1 })).toContain("bank.exceeds_slot_count");
    expect(bad(Array.from({ length: 17 }, () => ({ profile: p, version: "1.0.0" })))).toContain("bank.too_many_slots");
    const nan = quietProfile();
    nan.pump.points[0]!.dutyPct = Number.NaN;
    expect(bad([{ profile: nan, version: "1.0.0" }])).toContain("bank.value_not_finite");
    expect(bad([{ profile: {} as never, version: "1.0.0" }])).toEqual(["bank.bad_input"]);
    expect(bad(null as never)).toEqual(["bank.bad_input"]);
  });

  it("property: the decoder never throws on random bytes, and random bytes after a valid header fail cleanly", () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => {
        const r = decodeBank(bytes);
        expect(typeof r.ok).toBe("boolean");
        if (!r.ok) expect(r.errors.length).toBeGreaterThan(0);
      }),
      { numRuns: 2000 },
    );
    const valid = encodeOk([{ profile: quietProfile(), version: "1.0.0" }]);
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 1, maxLength: 200 }), fc.nat(), (noise, at) => {
        const b = valid.slice();
        b.set(noise.subarray(0, b.length - 8), 8 + (at % 8));
        expect(() => decodeBank(b)).not.toThrow();
      }),
      { numRuns: 1000 },
    );
    expect(decodeBank("LKPB" as unknown as Uint8Array).errors[0]!.code).toBe("bank.not_bytes");
  });
});

describe("strict bank decoder", () => {
  const image = () => encodeOk([{ profile: quietProfile(), version: "1.0.0" }]);
  /** Rewrites a header byte and recomputes the CRC, so only the header rule can object. */
  const withHeader = (bytes: Uint8Array, offset: number, value: number): Uint8Array => {
    const b = bytes.slice();
    b[offset] = value;
    new DataView(b.buffer).setUint32(b.length - 4, zlib.crc32(b.subarray(0, b.length - 4)), true);
    return b;
  };

  it("refuses a header with 0 slots even when the CRC matches", () => {
    const d = decodeBank(withHeader(image(), 5, 0));
    expect(d.ok).toBe(false);
    expect(d.errors.map((e) => e.code)).toEqual(["bank.no_slots"]);
  });

  it("refuses more slots than the header's length has room for", () => {
    // One slot of 4 + 4 points is 15 + 8 + 16 = 39 bytes; the 51-byte image leaves 39 bytes for slots,
    // room for 1 slot of the smallest size (23 bytes: two curves of one point).
    const bytes = image();
    expect(bytes.length).toBe(8 + 39 + 4);
    const d = decodeBank(withHeader(bytes, 5, 2));
    expect(d.errors[0]).toMatchObject({ code: "bank.slots_exceed_length", expected: 1, actual: 2 });
    expect(d.ok).toBe(false);
  });

  it("refuses anything but erased memory (0xFF) after the CRC, naming the byte", () => {
    const bytes = image();
    const dump = new Uint8Array(bytes.length + 40).fill(0xff);
    dump.set(bytes);
    expect(decodeBank(dump).ok).toBe(true);
    dump[bytes.length + 17] = 0x00;
    const d = decodeBank(dump);
    expect(d.ok).toBe(false);
    expect(d.errors).toEqual([expect.objectContaining({ code: "bank.trailing_data", offset: bytes.length + 17, actual: 0 })]);
  });

  it("reports every single-byte change of the demo images, exhaustively (every position, every other value)", () => {
    const images = demoBankImages();
    expect(images.length).toBeGreaterThanOrEqual(3);
    let tried = 0;
    for (const { name, bytes } of images) {
      expect(decodeBank(bytes).ok, name).toBe(true);
      // As read back from a board: the image, then erased memory.
      const dump = new Uint8Array(bytes.length + 16).fill(0xff);
      dump.set(bytes);
      for (let at = 0; at < dump.length; at++) {
        for (let value = 0; value < 256; value++) {
          if (value === dump[at]) continue;
          const changed = dump.slice();
          changed[at] = value;
          const d = decodeBank(changed);
          tried++;
          if (d.ok || d.errors.length === 0) throw new Error(`${name}: byte ${at} changed to 0x${value.toString(16)} was read as a sound image`);
        }
      }
    }
    expect(tried).toBe(images.reduce((n, i) => n + (i.bytes.length + 16) * 255, 0));
  }, 180_000);

  it("reports every change of one character of a demo image's Intel HEX (every position; every hex digit, separator and control byte), or reads back the same bytes", () => {
    const { bytes } = demoBankImages()[1]!;
    const text = new TextEncoder().encode(writeIntelHex(bytes, 0x0801f800));
    const values = [..."0123456789ABCDEFabcdef: \t\r\n"].map((c) => c.charCodeAt(0)).concat([0x00, 0x7f, 0xff]);
    let reported = 0;
    let tried = 0;
    for (let at = 0; at < text.length; at++) {
      for (const value of values) {
        tried++;
        if (value === text[at]) continue;
        const changed = text.slice();
        changed[at] = value;
        const hex = readIntelHex(new TextDecoder().decode(changed));
        if (!hex.ok || !decodeBank(hex.bytes).ok) {
          reported++;
          continue;
        }
        // Only a change of the line ending or trailing space can leave the file sound, and then its bytes are the image's.
        expect(hex.bytes).toEqual(bytes);
        expect(hex.startAddress).toBe(0x0801f800);
      }
    }
    expect(tried).toBeGreaterThan(text.length * 25);
    expect(reported).toBeGreaterThan(tried * 0.95);
  }, 180_000);

  it("property: banks of hundreds of bytes round-trip and any one changed byte is reported", () => {
    let largest = 0;
    fc.assert(
      fc.property(fc.array(validProfileArb, { minLength: 1, maxLength: 16, size: "max" }), fc.nat(), fc.integer({ min: 1, max: 255 }), (profiles, pick, delta) => {
        const bytes = encodeOk(profiles.map((p, i) => ({ profile: p, version: `1.${i}.0` })));
        largest = Math.max(largest, bytes.length);
        const d = decodeBank(bytes);
        expect(d.ok).toBe(true);
        expect(d.slots).toHaveLength(profiles.length);
        const changed = bytes.slice();
        const at = pick % bytes.length;
        changed[at] = (changed[at]! + delta) & 0xff;
        expect(decodeBank(changed).ok).toBe(false);
      }),
      { numRuns: 300 },
    );
    // Reached realistic images: several slots of several points (fast-check's default size stays near 10 elements).
    expect(largest).toBeGreaterThanOrEqual(400);
  }, 120_000);
});
