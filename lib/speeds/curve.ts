import type { CurvePoint } from "../profile/types";

/**
 * Duty of a curve at a liquid temperature: linear interpolation between the two
 * neighbouring points, held at the first point's duty below it and at the last
 * point's duty above it (common practice for firmware fan curves).
 *
 * Expects points sorted by strictly increasing `tempC` (what validation
 * enforces). Returns NaN for an empty curve or a non-finite temperature.
 */
export function dutyAtTemp(points: readonly CurvePoint[], tempC: number): number {
  const first = points[0];
  if (first === undefined || !Number.isFinite(tempC)) return Number.NaN;
  if (tempC <= first.tempC) return first.dutyPct;
  for (let i = 1; i < points.length; i++) {
    const hi = points[i]!;
    if (tempC <= hi.tempC) {
      const lo = points[i - 1]!;
      const span = hi.tempC - lo.tempC;
      if (span <= 0) return hi.dutyPct;
      return lo.dutyPct + ((hi.dutyPct - lo.dutyPct) * (tempC - lo.tempC)) / span;
    }
  }
  return points[points.length - 1]!.dutyPct;
}

/** Highest duty any point of the curve asks for (NaN for an empty curve). */
export function maxDutyPct(points: readonly CurvePoint[]): number {
  if (points.length === 0) return Number.NaN;
  let max = -Infinity;
  for (const p of points) if (p.dutyPct > max) max = p.dutyPct;
  return max;
}
