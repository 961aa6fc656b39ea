import type { SlotCodes } from "./codes";
import { DECI_C_PER_TEMP_CODE } from "./control";

/** A sampled liquid temperature, one reading per control tick (0.1 °C; null = no reading). */
export interface TraceInput {
  name: string;
  description: string;
  tempsDeciC: (number | null)[];
}

const clampDeci = (t: number): number => Math.max(-400, Math.min(1500, t));

function ramp(from: number, to: number, stepDeci: number): number[] {
  const out: number[] = [];
  const dir = to >= from ? 1 : -1;
  for (let t = from; dir > 0 ? t < to : t > to; t += dir * stepDeci) out.push(t);
  out.push(to);
  return out;
}

const hold = (t: number | null, ticks: number): (number | null)[] => Array.from({ length: ticks }, () => t);

/** Triangle wave of ± `amplitudeDeci` around `centreDeci`, `periods` times, 8 ticks a period. */
function dither(centreDeci: number, amplitudeDeci: number, periods: number): number[] {
  const shape = [0, 0.5, 1, 0.5, 0, -0.5, -1, -0.5];
  const out: number[] = [];
  for (let p = 0; p < periods; p++) for (const f of shape) out.push(clampDeci(centreDeci + Math.round(f * amplitudeDeci)));
  return out;
}

/** Seeded 32-bit linear congruential generator (Numerical Recipes constants), so the walk is the same on every run. */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s;
  };
}

/**
 * The transient traces the vectors give for one slot, built from its own codes so
 * they cross its points, fan stop and critical temperature: a warm-up past the
 * critical temperature and a slow cool-down (hysteresis and ramp-down), a load step
 * (ramp-up limit), sensor dropouts of one sample and of several, also while the fans
 * are stopped, a dither inside the hysteresis band around a point and the fan stop,
 * and a seeded random walk with occasional missing readings.
 */
export function slotTraces(codes: SlotCodes, seed: number): TraceInput[] {
  const critical = codes.criticalTempCode * DECI_C_PER_TEMP_CODE;
  const pumpPoints = codes.pump.points.map((p) => p.tempCode * DECI_C_PER_TEMP_CODE);
  const firstPoint = Math.min(...pumpPoints, critical);
  const lastPoint = Math.max(...pumpPoints);
  const middle = Math.round((firstPoint + Math.min(lastPoint, critical)) / 2);
  const idle = clampDeci(Math.min(250, firstPoint - 20));
  const stop = codes.fanStopTempCode === null ? null : codes.fanStopTempCode * DECI_C_PER_TEMP_CODE;
  const hysteresis = Math.max(codes.pump.hysteresisCode, codes.fans.hysteresisCode);

  const traces: TraceInput[] = [
    {
      name: "warm-up and cool-down",
      description: "0.7 °C per tick from idle to 3 °C past the critical temperature, 5 ticks there, then 0.3 °C per tick back to idle",
      tempsDeciC: [...ramp(idle, clampDeci(critical + 30), 7), ...hold(clampDeci(critical + 30), 5), ...ramp(clampDeci(critical + 30), idle, 3)],
    },
    {
      name: "load step",
      description: "idle, a step to the middle of the pump curve for 30 ticks, to 2 °C past critical for 5, then back to idle for 60",
      tempsDeciC: [...hold(idle, 5), ...hold(middle, 30), ...hold(clampDeci(critical + 20), 5), ...hold(idle, 60)],
    },
    {
      name: "sensor dropout",
      description: "steady mid-curve with one missing reading (bridged), then four missing (sensor-loss duty), then readings again",
      tempsDeciC: [...hold(middle, 10), null, ...hold(middle, 10), ...hold(null, 4), ...hold(middle, 30)],
    },
    {
      name: "hysteresis dither",
      description: "a triangle wave inside and just past the hysteresis band around the middle of the pump curve",
      tempsDeciC: [...hold(middle, 3), ...dither(middle, hysteresis + 5, 3), ...dither(middle, Math.max(1, hysteresis - 2), 2)],
    },
  ];
  if (stop !== null) {
    const quiet = clampDeci(stop - 20);
    traces.push({
      name: "fan stop",
      description: "below the fan stop temperature with one and then three missing readings, a dither around the stop temperature, and a rise past it",
      tempsDeciC: [...hold(quiet, 10), null, ...hold(quiet, 10), ...hold(null, 3), ...hold(quiet, 20), ...dither(stop, codes.fans.hysteresisCode + 5, 3), ...ramp(quiet, clampDeci(stop + 40), 4), ...hold(clampDeci(stop + 40), 10)],
    });
  }
  const next = lcg(seed);
  const walk: (number | null)[] = [];
  let t = middle;
  for (let i = 0; i < 240; i++) {
    const r = next();
    if (r % 40 === 0) {
      walk.push(null);
      continue;
    }
    t = Math.max(idle - 50, Math.min(clampDeci(critical + 50), t + ((r >>> 8) % 31) - 15));
    walk.push(t);
  }
  traces.push({ name: "random walk", description: "a seeded random walk of up to ±1.5 °C per tick with a missing reading about one tick in 40", tempsDeciC: walk });
  return traces;
}
