import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { decodeBank, dutyAtTemp, encodeBank, quantise, type CoolingProfile } from "@/lib/engine";
import { bankVectors, curveDutyCode, flashedStateAt, runTrace, slotCodes, steadyDutyCodes, type CurveCodes, type SlotCodes } from "@/lib/firmware";
import { evaluateEditorText } from "@/lib/registry/editor-evaluation";
import { exampleHardware, quietProfile, validProfileArb } from "../engine/fixtures";

/** A curve through (40 °C, 40 %) and (50 °C, 45 %): codes (80, 80) and (100, 90). */
const curve: CurveCodes = { hysteresisCode: 20, rampUpCode: 10, rampDownCode: 4, points: [{ tempCode: 80, dutyCode: 80 }, { tempCode: 100, dutyCode: 90 }] };
const slot: SlotCodes = { criticalTempCode: 120, sensorLossDutyCode: 200, fanStopTempCode: 70, pump: curve, fans: curve };

describe("integer control law, worked by hand", () => {
  it("interpolates linearly and rounds up to the next 0.5 % step", () => {
    // Worked by hand: at 43.3 °C the line gives 40 + 5·3.3/10 = 41.65 %, i.e. 83.3 steps of 0.5 %, stored up as 84 (42.0 %).
    expect(curveDutyCode(curve, 433)).toBe(84);
    // At 44.0 °C exactly 42.0 % (84 steps): no rounding.
    expect(curveDutyCode(curve, 440)).toBe(84);
    // At 44.1 °C 42.05 %, 84.1 steps, up to 85.
    expect(curveDutyCode(curve, 441)).toBe(85);
    // Held at the end points outside the curve.
    expect(curveDutyCode(curve, 100)).toBe(80);
    expect(curveDutyCode(curve, 900)).toBe(90);
  });

  it("applies the critical override and the fan stop in the steady state", () => {
    // Critical 60 °C: full duty (200 steps) from 60.0 °C on; fans stop below 35 °C.
    expect(steadyDutyCodes(slot, 600)).toEqual({ pumpDutyCode: 200, fanDutyCode: 200, fansStopped: false });
    expect(steadyDutyCodes(slot, 599).pumpDutyCode).toBe(90);
    expect(steadyDutyCodes(slot, 349)).toEqual({ pumpDutyCode: 80, fanDutyCode: 0, fansStopped: true });
    expect(steadyDutyCodes(slot, 350).fansStopped).toBe(false);
  });

  it("holds a falling temperature for the hysteresis and limits the ramp per tick", () => {
    // Hysteresis 2.0 °C, worked by hand: 45.0 → 44.0 (held 45.0) → 42.9 (held 44.9) → 43.5 (held 44.9).
    // Held 45.0 °C gives 42.5 % = 85 steps; held 44.9 °C gives 42.45 % = 84.9 steps, up to 85.
    const out = runTrace(slot, [450, 440, 429, 435]);
    expect(out.map((o) => o.pumpDutyCode)).toEqual([85, 85, 85, 85]);
    // Ramp up 10 steps a tick (5 %/s): 40 % → 45 % (80 → 90 steps) in one tick; down 4 steps a tick (2 %/s).
    const ramp = runTrace(slot, [400, 500, 500, 380, 380, 380, 380]);
    expect(ramp.map((o) => o.pumpDutyCode)).toEqual([80, 90, 90, 86, 82, 80, 80]);
  });

  it("bridges one missing reading, then falls back to the sensor-loss duty without losing the hysteresis", () => {
    const out = runTrace(slot, [450, null, 450, null, null, null, 440]);
    expect(out.map((o) => o.pumpDutyCode)).toEqual([85, 85, 85, 85, 200, 200, 196]);
    expect(out.map((o) => o.sensorLost)).toEqual([false, false, false, false, true, true, false]);
    expect(out[1]!.glitchHeld).toBe(true);
    // Held temperature survives the loss: 44.0 °C after 45.0 °C stays held at 45.0 °C (target 85), so the ramp-down from 200 continues.
    const longer = runTrace(slot, [450, null, null, 440, 440, ...Array<number>(40).fill(440)]);
    expect(longer.at(-1)!.pumpDutyCode).toBe(85);
  });

  it("fans stopped below the stop temperature stay stopped through a one-sample dropout", () => {
    const out = runTrace(slot, [300, 300, null, 300, 300]);
    expect(out.map((o) => o.fanDutyCode)).toEqual([0, 0, 0, 0, 0]);
  });
});

describe("integer control law against the engine's floating-point preview", () => {
  it("steady duty is the engine's curve duty of the quantised profile rounded up to the next 0.5 % step, never below it", () => {
    let checked = 0;
    let maxPoints = 0;
    fc.assert(
      fc.property(validProfileArb, fc.integer({ min: 0, max: 1000 }), (profile, tempDeciC) => {
        const q = quantise(profile);
        const codes = slotCodes(profile);
        maxPoints = Math.max(maxPoints, profile.pump.points.length);
        for (const [name, c] of [["pump", codes.pump], ["fans", codes.fans]] as const) {
          const exactPct = dutyAtTemp(q[name].points, tempDeciC / 10);
          const storedPct = curveDutyCode(c, tempDeciC) / 2;
          // 1e-9: the engine's floating point; the integer value is exact.
          expect(storedPct).toBeGreaterThanOrEqual(exactPct - 1e-9);
          expect(storedPct).toBeLessThan(exactPct + 0.5);
          checked++;
        }
      }),
      { numRuns: 400, seed: 7 },
    );
    expect(checked).toBe(800);
    expect(maxPoints).toBeGreaterThanOrEqual(7);
  });

  it("the bank stores exactly the codes the control law reads (encode → decode)", () => {
    fc.assert(
      fc.property(validProfileArb, (profile: CoolingProfile) => {
        const r = encodeBank([{ profile, version: "1.0.0" }]);
        expect(r.ok).toBe(true);
        if (r.ok) expect(decodeBank(r.bytes).slots[0]!.codes).toEqual(slotCodes(profile));
      }),
      { numRuns: 200, seed: 11 },
    );
  });
});

describe("the editor's as-flashed curve is the vectors' sweep", () => {
  it("every plotted as-flashed speed equals the speed of the vectors' duty code at that temperature", () => {
    const profile = quietProfile();
    const hw = exampleHardware();
    const encoded = encodeBank([{ profile, version: "1.0.0" }]);
    if (!encoded.ok) throw new Error("example profile does not encode");
    const vectors = bankVectors(encoded.bytes);
    if (!vectors.ok) throw new Error("no vectors");
    const sweep = vectors.vectors.slots[0]!.sweep;
    const { rows } = evaluateEditorText(JSON.stringify(profile), hw);
    expect(rows.length).toBeGreaterThan(90);
    for (const row of rows) {
      const i = sweep.tempCode.indexOf(Math.round(row.tempC * 2));
      expect(i, `${row.tempC} °C is on the sweep`).toBeGreaterThanOrEqual(0);
      const fromVectors = flashedStateAt(slotCodes(profile), hw, row.tempC);
      expect(fromVectors.pumpDutyPct).toBe(sweep.pumpDutyCode[i]! / 2);
      expect(fromVectors.fanDutyPct).toBe(sweep.fanDutyCode[i]! / 2);
      expect(row.pumpRpmFlashed).toBe(Math.round(fromVectors.pumpRpm));
      expect(row.fanRpmFlashed).toBe(Math.round(fromVectors.fanRpm));
    }
  });
});
