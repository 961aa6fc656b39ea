/**
 * Scales, ticks and label placement for the SVG plots. Pure functions (no React),
 * so the layout rules are unit-tested on their own.
 */

/** A linear map from a data domain to pixels, and back. */
export interface LinearScale {
  (value: number): number;
  invert(px: number): number;
  domain: readonly [number, number];
  range: readonly [number, number];
}

export function linearScale(domain: readonly [number, number], range: readonly [number, number]): LinearScale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
  const scale = ((v: number) => r0 + (v - d0) * k) as LinearScale;
  scale.invert = (px: number) => (k === 0 ? d0 : d0 + (px - r0) / k);
  scale.domain = domain;
  scale.range = range;
  return scale;
}

/** The "nice" step (1, 2, 2.5 or 5 × a power of ten) that splits `span` into about `count` parts. */
export function niceStep(span: number, count: number): number {
  if (!(span > 0) || !(count > 0)) return 1;
  const raw = span / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const fraction = raw / power;
  const nice = fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 2.5 ? 2.5 : fraction <= 5 ? 5 : 10;
  return nice * power;
}

/**
 * Evenly spaced ticks covering [min, max]: the domain is widened outwards to whole
 * steps, so the first and last tick are the domain's ends and every gap is equal.
 */
export function evenTicks(min: number, max: number, count = 5): { domain: [number, number]; ticks: number[] } {
  const step = niceStep(max - min, count);
  const lo = Math.floor(min / step + 1e-9) * step;
  const hi = Math.ceil(max / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = lo; v <= hi + step / 2; v += step) ticks.push(Math.round(v * 1e6) / 1e6);
  return { domain: [lo, hi === lo ? lo + step : hi], ticks };
}

/** A motor's duty → RPM as the handles sit: the real speed above the minimum duty, and below it a straight line to 0 at 0 %. */
export interface DutyAxis {
  minDutyPct: number;
  rpmAtMinDuty: number;
  maxRpm: number;
}

/**
 * Where a handle for `dutyPct` sits on the RPM axis. Above the motor's minimum
 * duty it is the speed the motor runs (the plotted curve passes through it);
 * below, where the motor holds its minimum speed, the handle still moves so the
 * duty can be read and dragged: it falls linearly to 0 RPM at 0 %.
 */
export function dutyToHandleRpm(dutyPct: number, motor: DutyAxis): number {
  const duty = Math.min(100, Math.max(0, dutyPct));
  if (duty <= motor.minDutyPct) return motor.minDutyPct > 0 ? (motor.rpmAtMinDuty * duty) / motor.minDutyPct : motor.rpmAtMinDuty;
  return motor.rpmAtMinDuty + ((motor.maxRpm - motor.rpmAtMinDuty) * (duty - motor.minDutyPct)) / (100 - motor.minDutyPct);
}

/** The duty a handle at `rpm` stands for: the inverse of dutyToHandleRpm, not clamped. */
export function handleRpmToDuty(rpm: number, motor: DutyAxis): number {
  if (rpm <= motor.rpmAtMinDuty) return motor.rpmAtMinDuty > 0 ? (rpm / motor.rpmAtMinDuty) * motor.minDutyPct : motor.minDutyPct;
  if (motor.maxRpm <= motor.rpmAtMinDuty) return 100;
  return motor.minDutyPct + ((rpm - motor.rpmAtMinDuty) * (100 - motor.minDutyPct)) / (motor.maxRpm - motor.rpmAtMinDuty);
}

/** A horizontal reference line's label to place: its line's y in pixels. */
export interface LabelWish {
  id: string;
  y: number;
}

/** A placed label: which side of the plot, and its text baseline y. */
export interface PlacedLabel {
  id: string;
  side: "left" | "right";
  y: number;
}

/**
 * Places the labels of horizontal reference lines (motor limits) so that they
 * neither overlap each other nor sit on a curve. Each label goes just above its
 * line, at the left or the right end of the plot, whichever end is farther from
 * the curves that pass there (`curveYAt("left" | "right")` gives their pixel ys);
 * labels on the same side are then pushed apart by at least `gapPx`.
 */
export function placeLimitLabels(wishes: readonly LabelWish[], curveYsAt: (side: "left" | "right") => readonly number[], gapPx = 13, textHeightPx = 11): PlacedLabel[] {
  const clearance = (side: "left" | "right", baseline: number) => {
    let nearest = Infinity;
    for (const y of curveYsAt(side)) {
      // The label occupies [baseline - textHeight, baseline]; distance from the curve to that box.
      const d = y < baseline - textHeightPx ? baseline - textHeightPx - y : y > baseline ? y - baseline : 0;
      nearest = Math.min(nearest, d);
    }
    return nearest;
  };
  const placed: PlacedLabel[] = wishes.map((w) => {
    const baseline = w.y - 3;
    return { id: w.id, y: baseline, side: clearance("left", baseline) >= clearance("right", baseline) ? "left" : "right" };
  });
  for (const side of ["left", "right"] as const) {
    const group = placed.filter((p) => p.side === side).sort((a, b) => a.y - b.y);
    for (let i = 1; i < group.length; i++) {
      const prev = group[i - 1]!;
      const cur = group[i]!;
      if (cur.y - prev.y < gapPx) cur.y = prev.y + gapPx;
    }
  }
  return placed;
}

/** An SVG path through points, skipping non-finite values (gaps). */
export function linePath(xs: readonly number[], ys: readonly number[]): string {
  let d = "";
  let pen = false;
  for (let i = 0; i < xs.length; i++) {
    const x = xs[i]!;
    const y = ys[i]!;
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      pen = false;
      continue;
    }
    d += `${pen ? "L" : "M"}${x.toFixed(1)},${y.toFixed(1)}`;
    pen = true;
  }
  return d;
}

/** A closed SVG area between an upper and a lower line over the same xs. */
export function bandPath(xs: readonly number[], upper: readonly number[], lower: readonly number[]): string {
  if (xs.length === 0) return "";
  let d = "";
  for (let i = 0; i < xs.length; i++) d += `${i === 0 ? "M" : "L"}${xs[i]!.toFixed(1)},${upper[i]!.toFixed(1)}`;
  for (let i = xs.length - 1; i >= 0; i--) d += `L${xs[i]!.toFixed(1)},${lower[i]!.toFixed(1)}`;
  return `${d}Z`;
}
