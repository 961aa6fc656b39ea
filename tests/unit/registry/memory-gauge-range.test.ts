import { describe, expect, it } from "vitest";
import { memoryUse } from "@/lib/registry/editor-evaluation";
import { admittedRevisions } from "@/lib/registry/range-match";
import { buildVersionImage } from "@/lib/registry/version-image";
import type { CoolingProfile } from "@/lib/engine";

// An invented board in three revisions, shaped like the demo's: the first stores 6 points per curve.
const revisions = [
  { revision: "1.0.0", memoryBytes: 256, slotCount: 2, maxPointsPerCurve: 6, baseAddress: 0x0800f000, pwmFrequencyHz: 25000, tachPulsesPerRev: 2 },
  { revision: "1.1.0", memoryBytes: 512, slotCount: 3, maxPointsPerCurve: 8, baseAddress: 0x0800f000, pwmFrequencyHz: 25000, tachPulsesPerRev: 2 },
  { revision: "2.0.0", memoryBytes: 2048, slotCount: 4, maxPointsPerCurve: 16, baseAddress: 0x0801f800, pwmFrequencyHz: 25000, tachPulsesPerRev: 2 },
];
const cooler = { name: "Test 240", radiatorMm: 240, fanCount: 2, radiatorKPerWAtMinFan: 0.11, radiatorKPerWAtMaxFan: 0.045 };
const fan = { kind: "fan" as const, name: "Test fan", minDutyPct: 20, rpmAtMinDuty: 450, maxRpm: 2000, tachPulsesPerRev: 2, refSoundDbA: 33, refRpm: 2000, soundExponent: 50, soundTable: null, stopsAtZeroDuty: true, flowAtMaxRpmLpm: null };
const pump = { kind: "pump" as const, name: "Test pump", minDutyPct: 40, rpmAtMinDuty: 1400, maxRpm: 2900, tachPulsesPerRev: 4, refSoundDbA: 24, refRpm: 2900, soundExponent: 50, soundTable: null, stopsAtZeroDuty: false, flowAtMaxRpmLpm: 1.4 };

/** A valid profile whose fan curve has 7 points: more than revision 1.0.0 stores. */
const sevenPoints: CoolingProfile = {
  formatVersion: 1,
  name: "Seven points",
  criticalTempC: 60,
  sensorLossDutyPct: 100,
  pump: { points: [{ tempC: 20, dutyPct: 40 }, { tempC: 35, dutyPct: 60 }, { tempC: 45, dutyPct: 80 }, { tempC: 55, dutyPct: 100 }], hysteresisC: 1, rampUpPctPerSec: 10, rampDownPctPerSec: 5 },
  fans: {
    points: [20, 30, 36, 42, 48, 54, 58].map((tempC, i) => ({ tempC, dutyPct: [25, 30, 40, 55, 70, 85, 100][i]! })),
    hysteresisC: 1,
    rampUpPctPerSec: 10,
    rampDownPctPerSec: 5,
  },
};

/** The gauge as the editor shows it for a typed range: what the range admits, then the fit. */
const gaugeFor = (boardRange: string) => memoryUse(sevenPoints, boardRange, revisions, admittedRevisions(boardRange, revisions));

function publish(boardRange: string) {
  return buildVersionImage({ text: JSON.stringify(sevenPoints), version: "1.0.0", boardRange, cooler, fan, pump, revisions });
}

describe("the editor's memory gauge judges the typed range as publishing does", () => {
  it("names revision 1.0.0 as unable to hold a 7-point curve under >=1.0.0, with the same sentence publishing refuses with", () => {
    const gauge = gaugeFor(">=1.0.0");
    const refused = publish(">=1.0.0");
    expect(refused.ok).toBe(false);
    expect(gauge.rangeProblem).toBe(refused.ok ? null : refused.message);
    expect(gauge.rangeProblem).toContain("revision 1.0.0 (a curve has 7 points; it stores at most 6)");
    expect(gauge.suggestedRange).toBe(">=1.1.0 <=2.0.0");
    const first = gauge.rows.find((r) => r.revision === "1.0.0")!;
    expect(first).toMatchObject({ inRange: true, fits: false });
  });

  it("finds no problem where publishing accepts, and counts the image bytes the encoder writes", () => {
    const gauge = gaugeFor(">=1.1.0");
    const accepted = publish(">=1.1.0");
    expect(accepted.ok).toBe(true);
    expect(gauge.rangeProblem).toBeNull();
    expect(gauge.rows.map((r) => r.inRange)).toEqual([false, true, true]);
    if (accepted.ok) for (const r of gauge.rows) expect(r.imageBytes).toBe(accepted.image.encodedBytes);
  });

  it("says nothing about a range still being typed", () => {
    expect(admittedRevisions(">=1.", revisions)).toBeNull();
    expect(gaugeFor(">=1.").rangeProblem).toBeNull();
    expect(gaugeFor(">=1.").rows.every((r) => r.inRange === null)).toBe(true);
  });

  it("takes what the range admits in version order, whatever order the revisions come in", () => {
    const shuffled = [revisions[2]!, revisions[0]!, revisions[1]!];
    expect(admittedRevisions(" >=1.0.0 <2.0.0 ", shuffled)).toEqual(["1.0.0", "1.1.0"]);
    const gauge = memoryUse(sevenPoints, ">=1.0.0", shuffled, admittedRevisions(">=1.0.0", shuffled));
    expect(gauge.rangeProblem).toBe(gaugeFor(">=1.0.0").rangeProblem);
  });
});
