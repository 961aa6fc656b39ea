import { createHash } from "node:crypto";
import zlib from "node:zlib";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { contentHashHex, encodeBank, imageSha256, reportDump, writeIntelHex, type CoolingProfile, type RegistryVersion } from "@/lib/engine";
import { exampleHardware, performanceProfile, quietProfile, validProfileArb } from "./fixtures";

const registry = (doc: CoolingProfile, version: string, id: string): RegistryVersion => ({ profileVersionId: id, version, contentHash: contentHashHex(doc), document: doc, profileName: doc.name, coolerName: "Example 360", hardware: exampleHardware() });

function bank(versions: readonly RegistryVersion[]): Uint8Array {
  const r = encodeBank(versions.map((v) => ({ profile: v.document, version: v.version, contentHashHex: v.contentHash })));
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.bytes;
}

/** Writes the CRC-32 trailer again, as someone hiding a change would (zlib's CRC-32, the format's trailer). */
function recomputeCrc(b: Uint8Array): Uint8Array {
  new DataView(b.buffer, b.byteOffset).setUint32(b.length - 4, zlib.crc32(b.subarray(0, b.length - 4)), true);
  return b;
}

// Offsets from docs/bank-format.md: header 8 bytes; in a slot the pump block starts at 15,
// its points at block offset 4, 2 bytes each (temperature, duty).
const SLOT0 = 8;
const pumpDutyOffset = (slotOffset: number, pointIndex: number): number => slotOffset + 15 + 4 + 2 * pointIndex + 1;

describe("dump identification by content", () => {
  const quiet = registry(quietProfile(), "1.1.0", "pv-quiet");
  const perf = registry(performanceProfile(), "2.0.0", "pv-perf");

  it("calls a slot exact only when its bytes equal the registry's encoding", () => {
    const r = reportDump({ bytes: bank([quiet, perf]), fileName: "a.bin", known: [quiet, perf], builds: [] });
    expect(r.status).toBe("ok");
    expect(r.slots.map((s) => [s.match, s.profileVersionId])).toEqual([
      ["exact", "pv-quiet"],
      ["exact", "pv-perf"],
    ]);
    expect(r.faults).toEqual([]);
  });

  it("a changed curve byte with a recomputed CRC is altered, with the field in the trade's units", () => {
    const bytes = bank([quiet, perf]);
    // Quiet pump point 3 (people count from 1) is 45 °C / 70 %: duty code 140. Write 124 = 62 %.
    expect(bytes[pumpDutyOffset(SLOT0, 2)]).toBe(140);
    bytes[pumpDutyOffset(SLOT0, 2)] = 124;
    const r = reportDump({ bytes: recomputeCrc(bytes), fileName: null, known: [quiet, perf], builds: [] });
    expect(r.status).toBe("ok");
    expect(r.crc?.ok).toBe(true);
    expect(r.slots[0]).toMatchObject({ match: "altered", profileVersionId: "pv-quiet", differences: ["pump point 3: 62 % here, 70 % in v1.1.0"] });
    expect(r.slots[1]!.match).toBe("exact");
    expect(r.faults[0]).toMatch(/^Slot 1 claims v1\.1\.0 but is altered: pump point 3: 62 % here, 70 % in v1\.1\.0/);
  });

  it("a flipped byte without a new CRC: corrupt, and the slot is altered, not a known version", () => {
    const bytes = bank([quiet]);
    bytes[pumpDutyOffset(SLOT0, 0)] = bytes[pumpDutyOffset(SLOT0, 0)]! ^ 0x01;
    const r = reportDump({ bytes, fileName: null, known: [quiet], builds: [] });
    expect(r.status).toBe("corrupt");
    expect(r.slots[0]!.match).toBe("altered");
    // 40 % is code 80; flipping bit 0 gives 81 = 40.5 %.
    expect(r.slots[0]!.differences).toEqual(["pump point 1: 40.5 % here, 40 % in v1.1.0"]);
  });

  it("a slot with an out-of-range byte gets its own row saying why", () => {
    const bytes = bank([quiet, perf]);
    bytes[pumpDutyOffset(SLOT0, 1)] = 201;
    const r = reportDump({ bytes: recomputeCrc(bytes), fileName: null, known: [quiet, perf], builds: [] });
    expect(r.slots.map((s) => s.match)).toEqual(["undecodable", "exact"]);
    expect(r.slots[0]!.reason).toMatch(/pump point 1 duty byte 201 .* outside 0–200/);
    expect(r.faults.some((f) => f.startsWith("Slot 1 cannot be read"))).toBe(true);
  });

  it("runs the authoring safety rules on every decoded slot: sensor-loss duty 0 % is a fault", () => {
    const unsafe: CoolingProfile = { ...quietProfile(), sensorLossDutyPct: 0 };
    const bytes = bank([registry(unsafe, "9.0.0", "x")]);
    const r = reportDump({ bytes, fileName: null, known: [], builds: [] });
    expect(r.status).toBe("ok");
    expect(r.slots[0]!.match).toBe("unknown");
    expect(r.slots[0]!.findings.map((f) => [f.code, f.severity])).toContainEqual(["sensor_loss.below_curve_duty", "error"]);
    expect(r.faults.join("\n")).toMatch(/Slot 1 breaks a safety rule \(sensor_loss\.below_curve_duty\)/);
    // The pump's minimum duty from the cooler the version was published for (the example pump: 30 %).
    const lowPump: CoolingProfile = { ...quietProfile(), pump: { ...quietProfile().pump, points: quietProfile().pump.points.map((p, i) => (i === 0 ? { ...p, dutyPct: 20 } : p)) } };
    const published = registry(quietProfile(), "1.1.0", "pv-quiet");
    const low = bank([{ ...registry(lowPump, "1.1.0", "pv-quiet"), contentHash: published.contentHash }]);
    const lowReport = reportDump({ bytes: low, fileName: null, known: [published], builds: [] });
    expect(lowReport.slots[0]!.match).toBe("altered");
    expect(lowReport.slots[0]!.findings.map((f) => f.code)).toContain("pump.below_min_duty");
  });

  it("names the build whose bank the whole image is, by SHA-256, also from Intel HEX", () => {
    const bytes = bank([quiet, perf]);
    const build = { buildId: "b-1", version: "3.1.0", stage: "production", boardModelName: "TC-1", bankSha256: imageSha256(bytes) };
    const r = reportDump({ bytes: new TextEncoder().encode(writeIntelHex(bytes, 0x0801f800)), fileName: "a.hex", known: [quiet, perf], builds: [build] });
    expect(r.build).toEqual({ buildId: "b-1", version: "3.1.0", stage: "production", boardModelName: "TC-1" });
    // SHA-256 of the image as node:crypto computes it (FIPS 180-4), independent of the project's own implementation.
    expect(r.imageSha256).toBe(createHash("sha256").update(bytes).digest("hex"));
    const other = bytes.slice();
    other[pumpDutyOffset(SLOT0, 3)] = 199;
    expect(reportDump({ bytes: recomputeCrc(other), fileName: null, known: [quiet, perf], builds: [build] }).build).toBeUndefined();
  });

  it("property: no byte change in any slot, CRC recomputed, is ever exact (banks of hundreds of bytes)", () => {
    let largest = 0;
    fc.assert(
      fc.property(fc.array(validProfileArb, { minLength: 1, maxLength: 12, size: "max" }), fc.nat(), fc.integer({ min: 1, max: 255 }), (docs, pick, delta) => {
        const known = docs.map((d, i) => registry({ ...d, name: `P${i}` }, `1.${i}.0`, `pv-${i}`));
        const bytes = bank(known);
        largest = Math.max(largest, bytes.length);
        expect(reportDump({ bytes, fileName: null, known, builds: [] }).slots.every((s) => s.match === "exact")).toBe(true);
        // Any byte of any slot (header and CRC excluded: the CRC is recomputed).
        const at = 8 + (pick % (bytes.length - 12));
        const changed = bytes.slice();
        changed[at] = (changed[at]! + delta) & 0xff;
        const r = reportDump({ bytes: recomputeCrc(changed), fileName: null, known, builds: [] });
        expect(r.slots.filter((s) => s.match === "exact").length).toBeLessThan(known.length);
      }),
      { numRuns: 200 },
    );
    expect(largest).toBeGreaterThanOrEqual(300);
  }, 120_000);
});
