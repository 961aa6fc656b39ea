import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { quantise, simulateTransient, type TransientSample } from "@/lib/engine";
import { exampleHardware, quietProfile, validProfileArb } from "./fixtures";

/** What the fans are driven at: 0 while stopped. */
const fanDrive = (s: TransientSample): number => (s.fans.stopped ? 0 : s.fans.dutyPct);

describe("quantisation of the hysteresis", () => {
  it("rounds the band up to the next 0.1 °C step: a wider band keeps the higher duty longer", () => {
    const p = quietProfile();
    p.fans.hysteresisC = 1.51;
    p.pump.hysteresisC = 1.55;
    const q = quantise(p);
    expect(q.fans.hysteresisC).toBe(1.6);
    expect(q.pump.hysteresisC).toBe(1.6);
    // On the grid already: unchanged, also where 0.3 / 0.1 is 2.9999999999999996 in binary.
    p.fans.hysteresisC = 0.3;
    expect(quantise(p).fans.hysteresisC).toBe(0.3);
    // Worked by hand on the "Hush" fan curve (40 °C → 40 %, 50 °C → 70 %): held at 45 °C, the liquid
    // falls to 43.45 °C. A 1.6 °C band holds max(43.45, min(45, 45.05)) = 45 °C → 55 %; the 1.5 °C
    // band rounded down would have let it fall to 44.95 °C → 54.85 %.
    const authored = quietProfile();
    authored.fans.hysteresisC = 1.55;
    authored.fans.rampDownPctPerSec = 100;
    const trace = [
      { tSec: 0, tempC: 45 },
      { tSec: 1, tempC: 43.45 },
    ];
    const asFlashed = simulateTransient(quantise(authored), exampleHardware(), trace);
    expect(asFlashed[1]!.fans.heldTempC).toBe(45);
    expect(asFlashed[1]!.fans.dutyPct).toBeCloseTo(55, 9);
  });

  it("property: the as-flashed profile never drives the fans or the pump lower than the authored one on the same trace", () => {
    const hw = exampleHardware();
    const traceArb = fc.array(fc.oneof(fc.integer({ min: 150, max: 700 }).map((d) => d / 10), fc.constant(null)), { minLength: 100, maxLength: 400, size: "max" });
    let longest = 0;
    fc.assert(
      fc.property(validProfileArb, fc.integer({ min: 1, max: 99 }), traceArb, (grid, hundredths, temps) => {
        // On the stored grid except the hysteresis, which gets an off-grid part.
        const authored = structuredClone(grid);
        authored.fans.hysteresisC = Math.min(10, grid.fans.hysteresisC + hundredths / 1000);
        authored.pump.hysteresisC = Math.min(10, grid.pump.hysteresisC + hundredths / 1000);
        const trace = temps.map((tempC, tSec) => ({ tSec, tempC }));
        longest = Math.max(longest, trace.length);
        const a = simulateTransient(authored, hw, trace);
        const q = simulateTransient(quantise(authored), hw, trace);
        // One check per trace (not per sample): the smallest margin of the as-flashed drive over the authored one.
        let margin = Infinity;
        a.forEach((s, i) => {
          margin = Math.min(margin, fanDrive(q[i]!) - fanDrive(s), q[i]!.pump.dutyPct - s.pump.dutyPct);
        });
        expect(margin).toBeGreaterThanOrEqual(-1e-9);
      }),
      { numRuns: 100 },
    );
    expect(longest).toBeGreaterThanOrEqual(300);
  }, 60_000);
});
