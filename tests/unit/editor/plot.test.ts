import { describe, expect, it } from "vitest";
import { simulateTransient } from "@/lib/engine";
import { evaluateEditorText, plotRangeC, pointRows } from "@/lib/registry/editor-evaluation";
import { dutyToHandleRpm, evenTicks, handleRpmToDuty, niceStep, placeLimitLabels } from "@/components/profiles/charts/plot-geometry";
import { exampleHardware, quietProfile } from "../engine/fixtures";

describe("axis ticks", () => {
  // Common practice: tick steps of 1, 2 or 5 (and 2.5) × 10^k, after P. Heckbert, "Nice numbers for
  // graph labels", Graphics Gems I (1990) — from memory.
  it("are evenly spaced and cover the range, on nice steps", () => {
    for (const [min, max] of [[20, 70], [20, 65], [0, 2940], [0, 43.7], [15, 85]] as const) {
      const { domain, ticks } = evenTicks(min, max, 5);
      expect(domain[0]).toBeLessThanOrEqual(min);
      expect(domain[1]).toBeGreaterThanOrEqual(max);
      const gaps = ticks.slice(1).map((t, i) => t - ticks[i]!);
      expect(new Set(gaps.map((g) => g.toFixed(6))).size).toBe(1);
      expect(ticks[0]).toBe(domain[0]);
      expect(ticks[ticks.length - 1]).toBe(domain[1]);
    }
    // The compare plot's old ticks were 20/35/50/65/70: now 20, 30, …, 70.
    expect(evenTicks(20, 70, 5).ticks).toEqual([20, 30, 40, 50, 60, 70]);
    expect([1, 2, 2.5, 5].map((k) => k * 100)).toContain(niceStep(2940, 6));
  });
});

describe("handle positions", () => {
  const fan = exampleHardware().fan; // 20 % → 500 RPM, 100 % → 2000 RPM (examples/cooler-360.hardware.json)
  it("sit on the motor's speed above its minimum duty and read back the same duty", () => {
    // Intel 4-wire PWM fan spec rev 1.3 §3.4 (holds minimum speed below minimum duty) as the engine models it: linear from (20 %, 500) to (100 %, 2000).
    expect(dutyToHandleRpm(60, fan)).toBe(1250);
    expect(dutyToHandleRpm(100, fan)).toBe(2000);
    expect(dutyToHandleRpm(10, fan)).toBe(250);
    for (const duty of [0, 5, 10, 20, 33.5, 60, 99.5, 100]) expect(handleRpmToDuty(dutyToHandleRpm(duty, fan), fan)).toBeCloseTo(duty, 9);
  });
});

describe("limit labels", () => {
  it("never overlap each other and move to the end of the plot away from a curve", () => {
    const placed = placeLimitLabels(
      [
        { id: "fan max", y: 50 },
        { id: "pump max", y: 52 },
        { id: "fan min", y: 200 },
      ],
      // A curve runs through y 45 at the left end, nothing near at the right.
      (side) => (side === "left" ? [45, 46, 47] : [300]),
    );
    const bySide = (side: "left" | "right") => placed.filter((p) => p.side === side).map((p) => p.y).sort((a, b) => a - b);
    for (const side of ["left", "right"] as const) {
      const ys = bySide(side);
      ys.slice(1).forEach((y, i) => expect(y - ys[i]!).toBeGreaterThanOrEqual(13));
    }
    expect(placed.find((p) => p.id === "fan max")!.side).toBe("right");
    expect(placed.find((p) => p.id === "pump max")!.side).toBe("right");
  });
});

describe("editor evaluation", () => {
  const hw = exampleHardware();

  it("plots the cooling branch where the firmware's play operator settles after the liquid cools", () => {
    // Cross-check with the transient simulator (a different code path): heat to 65 °C, then cool slowly to
    // each temperature and hold it; the settled fan speed must be the plotted falling branch there.
    // Play (backlash) operator: M. A. Krasnosel'skii, A. V. Pokrovskii, Systems with Hysteresis (1989) — from memory.
    const profile = quietProfile();
    profile.fans.hysteresisC = 3;
    profile.pump.hysteresisC = 2;
    const { rows } = evaluateEditorText(JSON.stringify(profile), hw);
    for (const tempC of [32, 38, 45]) {
      const trace = [];
      let t = 0;
      for (let c = 65; c >= tempC; c -= 0.25) trace.push({ tSec: (t += 10), tempC: c });
      for (let i = 0; i < 100; i++) trace.push({ tSec: (t += 10), tempC });
      const last = simulateTransient(profile, hw, trace).at(-1)!;
      const row = rows.find((r) => r.tempC === tempC)!;
      expect(row.fanRpmFalling).toBe(Math.round(last.fans.rpm));
      expect(row.pumpRpmFalling).toBe(Math.round(last.pump.rpm));
    }
  });

  it("widens the plotted range to every point, and gives the points' speeds", () => {
    const profile = quietProfile();
    profile.fans.points[0]!.tempC = 12;
    expect(plotRangeC(profile).fromC).toBe(10);
    const rows = pointRows(profile, hw, "pump");
    // dutyToRpm of the example pump: (30 %, 1200) → (100 %, 2800), linear.
    rows.forEach((r) => expect(r.rpm).toBeCloseTo(r.dutyPct <= 30 ? 1200 : 1200 + ((2800 - 1200) * (r.dutyPct - 30)) / 70, 6));
  });
});

describe("editor plots with each kind of fan below its minimum duty (4-wire PWM fan spec rev. 1.3 §3.4)", () => {
  // Hush fans stop below 30 °C (band 1.5 °C); the example fan: 20 % → 500 RPM, stops at 0 % duty.
  const text = JSON.stringify(quietProfile());
  const at = (rows: ReturnType<typeof evaluateEditorText>["rows"], tempC: number) => rows.find((r) => r.tempC === tempC)!;

  it("a fan that stops at 0 % duty: authored, as-flashed and cooling branch show 0 RPM below the stop", () => {
    const { rows } = evaluateEditorText(text, exampleHardware());
    expect(at(rows, 25)).toMatchObject({ fanRpm: 0, fanRpmFlashed: 0, fanRpmFalling: 0 });
  });

  it("a fan that keeps its minimum speed: the same profile plots 500 RPM there, authored and as flashed, with the warning", () => {
    const base = exampleHardware();
    const hw = { ...base, fan: { ...base.fan, stopsAtZeroDuty: false } };
    const { rows, issues } = evaluateEditorText(text, hw);
    expect(at(rows, 25)).toMatchObject({ fanRpm: 500, fanRpmFlashed: 500, fanRpmFalling: 500 });
    expect(issues.map((i) => i.code)).toContain("fans.stop_on_fan_that_holds_speed");
    // Points table: the 30 °C point at 25 % runs at 500 + 1500·5/80 = 593.75 RPM (by hand) on both kinds.
    expect(pointRows(quietProfile(), hw, "fans")[0]!.rpm).toBeCloseTo(593.75, 9);
  });
});
