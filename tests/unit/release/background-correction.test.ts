import { describe, expect, it } from "vitest";
import { backgroundCorrectionK1, correctForBackground } from "@/lib/acoustics/background-correction";
import { compareMeasurements, MEASUREMENT_HEADER_WITH_BACKGROUND, parseMeasurementsCsv, soundGateIssues } from "@/lib/release/measurements";
import type { HardwareContext } from "@/lib/engine";

// ISO 3744:2010 §8.2.3 (background noise correction K1; the same correction in ISO 3745):
// K1 = −10·log10(1 − 10^(−0.1·ΔL)) dB, applied for 6 dB ≤ ΔL < 15 dB, none from 15 dB,
// and below 6 dB the source cannot be separated from the background. The limits are
// stated from memory of the standard, not checked against its text.
describe("background correction (ISO 3744:2010 §8.2.3)", () => {
  it("K1 at ΔL = 6 dB is 1.26 dB: 10^(−0.6) = 0.2512, 1 − 0.2512 = 0.7488, log10(0.7488) = −0.1256 → 1.256 dB (the standard's 1.3 dB rounded)", () => {
    expect(backgroundCorrectionK1(6)).toBeCloseTo(1.256, 3);
  });

  it("K1 at ΔL = 10 dB is 0.46 dB: 1 − 10^(−1) = 0.9, log10(0.9) = −0.04576 → 0.458 dB", () => {
    expect(backgroundCorrectionK1(10)).toBeCloseTo(0.458, 3);
  });

  it("corrects 30.0 dB(A) over a 24.0 dB(A) room to 28.74 dB(A), the energetic difference 10·log10(10^3.0 − 10^2.4) = 10·log10(1000 − 251.19) = 10·log10(748.81)", () => {
    const c = correctForBackground(30, 24);
    expect(c.state).toBe("corrected");
    expect(c.correctedDbA).toBeCloseTo(28.744, 3);
    expect(c.differenceDb).toBe(6);
  });

  it("corrects 32.0 dB(A) over a 22.0 dB(A) room to 31.54 dB(A): 10·log10(1584.89 − 158.49) = 10·log10(1426.40)", () => {
    expect(correctForBackground(32, 22).correctedDbA).toBeCloseTo(31.542, 3);
  });

  it("applies no correction from ΔL = 15 dB (K1 would be 0.14 dB: 10·log10(1/(1 − 10^(−1.5))) = 10·log10(1.03266))", () => {
    expect(correctForBackground(37, 22)).toEqual({ state: "uncorrected", correctedDbA: 37, correctionDb: 0, differenceDb: 15 });
    // Just under the limit the formula still applies: 14.9 dB → 0.143 dB.
    expect(correctForBackground(36.9, 22).correctionDb).toBeCloseTo(0.143, 3);
  });

  it("calls a point 5.9 dB above the background not comparable, and leaves a level without background as measured", () => {
    expect(correctForBackground(27.9, 22)).toMatchObject({ state: "too_close", correctedDbA: null });
    expect(correctForBackground(31, null)).toEqual({ state: "no_background", correctedDbA: 31, correctionDb: 0, differenceDb: null });
    // The precision grade's stricter limit (10 dB, from memory of ISO 3745) is a parameter.
    expect(correctForBackground(31, 22, 10).state).toBe("too_close");
  });
});

describe("the lab CSV scenarios of the sound gate", () => {
  // One fan and one pump, 40 dB(A) each at their reference speeds (2000 and 2900 RPM), fan-law exponent 50.
  const hw: HardwareContext = {
    fan: { kind: "fan", minDutyPct: 20, rpmAtMinDuty: 450, maxRpm: 2000, tachPulsesPerRev: 2, soundRefDbA: 40, soundRefRpm: 2000, soundExponent: 50 },
    fanCount: 1,
    pump: { kind: "pump", minDutyPct: 40, rpmAtMinDuty: 1400, maxRpm: 2900, tachPulsesPerRev: 4, soundRefDbA: 40, soundRefRpm: 2900, soundExponent: 50, flowAtMaxRpmLpm: 1.4 },
    radiator: { thermalResistanceAtMinFanKPerW: 0.1, thermalResistanceAtMaxFanKPerW: 0.04 },
    boardRevision: { version: "1.0.0", memoryBytes: 256, baseAddress: 0, slotCount: 2, maxPointsPerCurve: 6, pwmFrequencyHz: 25000, tachPulsesPerRev: 2 },
  };
  // Estimates worked by hand (fan law L = Lref − 50·log10(Nref/N), incoherent sum 10·log10(Σ10^(L/10))):
  //  pump 1400, fan  600: fan 40 − 26.14 = 13.86, pump 40 − 15.81 = 24.19 → 24.57 dB(A)
  //  pump 1600, fan  900: fan 40 − 17.34 = 22.66, pump 40 − 12.91 = 27.09 → 28.42 dB(A)
  //  pump 2200, fan 1400: fan 40 −  7.75 = 32.25, pump 40 −  6.00 = 34.00 → 36.23 dB(A)
  //  pump 2900, fan 2000: 40 and 40 → 43.01 dB(A)
  const csv = (rows: string[]) => [MEASUREMENT_HEADER_WITH_BACKGROUND, ...rows].join("\n");
  const read = (text: string) => {
    const parsed = parseMeasurementsCsv(text);
    if (!parsed.ok) throw new Error(parsed.errors.join("; "));
    return compareMeasurements(parsed.rows, hw, 3);
  };

  it("passes a realistic lab file from a 22 dB(A) room without a waiver, the low-speed points marked too close to background", () => {
    const rows = read(
      csv([
        "25,1400,600,26.0,22", // ΔL 4.0 dB: too close
        "30,1600,900,27.0", // ΔL 5.0 dB (background given once, on the first row): too close
        "45,2200,1400,36.4", // ΔL 14.4 dB: K1 = 0.16 dB → 36.24, 0.01 dB over the estimate
        "55,2900,2000,43.0", // ΔL 21 dB: no correction, 0.01 dB under the estimate
      ]),
    );
    expect(rows.map((r) => r.status)).toEqual(["too_close_to_background", "too_close_to_background", "within", "within"]);
    expect(rows[2]!.correctionDb).toBeCloseTo(0.161, 3);
    expect(rows[2]!.deltaDb).toBeCloseTo(36.4 - 0.161 - 36.226, 2);
    expect(rows.every((r) => r.backgroundDbA === 22)).toBe(true);
    expect(soundGateIssues(rows, 3)).toEqual([]);
  });

  it("fails the same file when one high-speed point is 5 dB above the estimate after correction, naming it", () => {
    const rows = read(csv(["25,1400,600,26.0,22", "30,1600,900,27.0,22", "45,2200,1400,36.4,22", "55,2900,2000,48.0,22"]));
    // 48.0 over 22: ΔL 26 dB, no correction; 48.0 − 43.01 = 4.99 dB over a 3 dB tolerance.
    expect(rows[3]).toMatchObject({ status: "above_tolerance", withinTolerance: false });
    expect(rows[3]!.deltaDb).toBeCloseTo(4.99, 2);
    expect(soundGateIssues(rows, 3)[0]).toMatch(/^1 of 2 comparable measured sound levels exceed the estimate by more than 3 dB \(worst: 48\.0 dB\(A\) after background correction against 43\.0 estimated at pump 2900 RPM, fans 2000 RPM\)/);
  });

  it("says so when every point is too close to background, asking for a quieter room or a waiver", () => {
    const rows = read(csv(["25,1400,600,25.0,22", "30,1600,900,26.5,22", "35,1800,1100,27.5,22"]));
    expect(rows.every((r) => r.status === "too_close_to_background")).toBe(true);
    expect(soundGateIssues(rows, 3)).toEqual([
      "All 3 measured points are within 6 dB of the room's background, so none can be compared with the estimate (ISO 3744:2010 §8.2.3 background criterion). Measure in a quieter room, or record a waiver with a reason.",
    ]);
  });

  it("does not fail a point that is quieter than the estimate, and refuses a background given on some rows only", () => {
    const [quiet] = read(csv(["55,2900,2000,38.0,22"]));
    expect(quiet!.status).toBe("within");
    const partial = parseMeasurementsCsv(csv(["25,1400,600,26.0,22", "30,1600,900,27.0,", "45,2200,1400,36.4,22"]));
    expect(partial).toEqual({ ok: false, errors: ["background_dba is given on 2 of 3 rows; give it on every row, or only on the first row for the whole session."] });
  });
});
