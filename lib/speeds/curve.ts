import type { CurvePoint } from "../profile/types";

/** Duty between two neighbouring points at `tempC` (lo.tempC < tempC ≤ hi.tempC): linear; the later point's duty when they share a temperature. */
function interpolate(lo: CurvePoint, hi: CurvePoint, tempC: number): number {
  const span = hi.tempC - lo.tempC;
  if (span <= 0) return hi.dutyPct;
  return lo.dutyPct + ((hi.dutyPct - lo.dutyPct) * (tempC - lo.tempC)) / span;
}

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
    if (tempC <= hi.tempC) return interpolate(points[i - 1]!, hi, tempC);
  }
  return points[points.length - 1]!.dutyPct;
}

/**
 * dutyAtTemp for a run of temperatures that mostly rise (a table, a sweep): remembers
 * the segment of the last answer and walks on from it, so a whole table costs one pass
 * over the points instead of one search per row. Same values as dutyAtTemp for every
 * temperature in any order; a curve whose temperatures fall somewhere is read by
 * dutyAtTemp itself.
 */
export class CurveReader {
  private readonly points: readonly CurvePoint[];
  private readonly ordered: boolean;
  /** Index of the first point at or above the last temperature asked (≥ 1). */
  private next = 1;

  constructor(points: readonly CurvePoint[]) {
    this.points = points;
    let ordered = true;
    for (let i = 1; i < points.length; i++) {
      if (!(points[i]!.tempC >= points[i - 1]!.tempC)) ordered = false;
    }
    this.ordered = ordered;
  }

  dutyAt(tempC: number): number {
    const points = this.points;
    const first = points[0];
    if (!this.ordered || first === undefined || !Number.isFinite(tempC)) return dutyAtTemp(points, tempC);
    if (tempC <= first.tempC) return first.dutyPct;
    const n = points.length;
    // dutyAtTemp's search finds the first point at or above tempC; with ordered points the ones before it are all below.
    let i = this.next;
    if (i > 1 && !(tempC > points[i - 1]!.tempC)) i = 1;
    while (i < n && tempC > points[i]!.tempC) i++;
    this.next = i < n ? i : n;
    return i < n ? interpolate(points[i - 1]!, points[i]!, tempC) : points[n - 1]!.dutyPct;
  }
}

/** Highest duty any point of the curve asks for (NaN for an empty curve). */
export function maxDutyPct(points: readonly CurvePoint[]): number {
  if (points.length === 0) return Number.NaN;
  let max = -Infinity;
  for (const p of points) if (p.dutyPct > max) max = p.dutyPct;
  return max;
}
