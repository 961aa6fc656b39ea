import type { HardwareContext } from "../hardware/types";
import type { CurveKind, CurvePoint, ProfileSettings } from "../profile/types";
import { TEMP_STEP_C } from "../bank/layout";
import { dutyAtTemp } from "../speeds/curve";

/** Schema limits of a point (schemas/cooling-profile.schema.json): 0–100 °C, 0–100 %. */
export const POINT_TEMP_MIN_C = 0;
export const POINT_TEMP_MAX_C = 100;
/** Schema limits of a curve's point count. */
export const MIN_POINTS_PER_CURVE = 2;
export const MAX_POINTS_PER_CURVE = 32;
/** Schema limits of the hysteresis, °C. */
export const HYSTERESIS_MAX_C = 10;

/** The range a value may take, and why each end is where it is (shown beside the handle). */
export interface Bound {
  min: number;
  max: number;
  minReason: string;
  maxReason: string;
}

/** A value after clamping, and the reason when the clamp changed it. */
export interface Clamped {
  value: number;
  reason?: string;
}

const fmt = (n: number): string => String(Math.round(n * 1000) / 1000);
const noun = (kind: CurveKind) => (kind === "pump" ? "pump" : "fan");

/**
 * Keeps `value` inside `bound`. When the current value already lies outside the
 * bound (a draft that breaks a rule), the range is widened to include it: a
 * handle never jumps on its own, it only refuses to move further the wrong way.
 */
export function clampToBound(value: number, bound: Bound, current?: number): Clamped {
  const min = current !== undefined && current < bound.min ? current : bound.min;
  const max = current !== undefined && current > bound.max ? current : bound.max;
  if (value < min) return { value: min, reason: bound.minReason };
  if (value > max) return { value: max, reason: bound.maxReason };
  return { value };
}

/**
 * Where point `index` of a curve may move in temperature: above the previous
 * point and below the next by at least one stored step (0.5 °C, so the points
 * stay apart after quantisation), inside the schema's 0–100 °C.
 */
export function pointTempBound(points: readonly CurvePoint[], kind: CurveKind, index: number): Bound {
  const prev = points[index - 1];
  const next = points[index + 1];
  return {
    min: prev ? prev.tempC + TEMP_STEP_C : POINT_TEMP_MIN_C,
    max: next ? next.tempC - TEMP_STEP_C : POINT_TEMP_MAX_C,
    minReason: prev
      ? `Stops ${TEMP_STEP_C} °C above ${noun(kind)} point ${index} (${fmt(prev.tempC)} °C): temperatures must increase from point to point.`
      : `A point's temperature is at least ${POINT_TEMP_MIN_C} °C.`,
    maxReason: next
      ? `Stops ${TEMP_STEP_C} °C below ${noun(kind)} point ${index + 2} (${fmt(next.tempC)} °C): temperatures must increase from point to point.`
      : `A point's temperature is at most ${POINT_TEMP_MAX_C} °C.`,
  };
}

/**
 * Where point `index` may move in duty: 0–100 %, not below the previous point
 * nor above the next (duties must not fall as the liquid warms), and for the
 * pump not below the pump's minimum duty (a pump must never stall).
 */
export function pointDutyBound(points: readonly CurvePoint[], kind: CurveKind, index: number, hw: HardwareContext): Bound {
  const prev = points[index - 1];
  const next = points[index + 1];
  let min = 0;
  let minReason = "A duty is at least 0 %.";
  if (kind === "pump" && hw.pump.minDutyPct > min) {
    min = hw.pump.minDutyPct;
    minReason = `Stops at the pump's minimum duty ${fmt(hw.pump.minDutyPct)} %: below it the pump may stall.`;
  }
  if (prev && prev.dutyPct > min) {
    min = prev.dutyPct;
    minReason = `Stops at ${fmt(prev.dutyPct)} %, the duty of ${noun(kind)} point ${index}: duties must not fall as the liquid warms.`;
  }
  let max = 100;
  let maxReason = "A duty is at most 100 %.";
  if (next && next.dutyPct < max) {
    max = next.dutyPct;
    maxReason = `Stops at ${fmt(next.dutyPct)} %, the duty of ${noun(kind)} point ${index + 2}: duties must not fall as the liquid warms.`;
  }
  return { min, max, minReason, maxReason };
}

/** Where the fans' stop temperature may move: 0 °C up to one step below the critical temperature. */
export function fanStopBound(profile: ProfileSettings): Bound {
  return {
    min: POINT_TEMP_MIN_C,
    max: profile.criticalTempC - TEMP_STEP_C,
    minReason: `The fan stop temperature is at least ${POINT_TEMP_MIN_C} °C.`,
    maxReason: `Stops ${TEMP_STEP_C} °C below the critical temperature ${fmt(profile.criticalTempC)} °C: the fans must run there.`,
  };
}

/** Where a curve's hysteresis may move: the schema's 0–10 °C. */
export function hysteresisBound(): Bound {
  return { min: 0, max: HYSTERESIS_MAX_C, minReason: "Hysteresis is at least 0 °C.", maxReason: `Hysteresis is at most ${HYSTERESIS_MAX_C} °C.` };
}

/** Rounds to the nearest multiple of `step` (for pointer drags, which land between steps). */
export function snapToStep(value: number, step: number): number {
  return Math.round(value / step) * step;
}

/** A new point and where it goes, or why none fits. */
export type PointInsertion = { ok: true; index: number; point: CurvePoint } | { ok: false; reason: string };

/**
 * A new point at (about) `tempC` on the curve as it is: the temperature snapped to
 * the stored 0.5 °C step and the duty the curve already asks there (rounded up to
 * the 0.5 % step), so adding a point does not change the curve's shape. Without a
 * temperature, the middle of the widest gap between neighbouring points. Refused when
 * the board revision (or the schema) allows no more points, or the spot has no room.
 */
export function newPointAt(points: readonly CurvePoint[], kind: CurveKind, maxPoints: number, tempC?: number): PointInsertion {
  const limit = Math.min(maxPoints, MAX_POINTS_PER_CURVE);
  if (points.length >= limit) return { ok: false, reason: `The ${noun(kind)} curve already has ${points.length} points, the most this board revision stores (${limit}): remove one first.` };
  let target = tempC;
  if (target === undefined) {
    let widest = -1;
    for (let i = 1; i < points.length; i++) {
      const gap = points[i]!.tempC - points[i - 1]!.tempC;
      if (gap > widest) {
        widest = gap;
        target = (points[i]!.tempC + points[i - 1]!.tempC) / 2;
      }
    }
    if (target === undefined) target = (points[0]?.tempC ?? 40) + 5;
  }
  const snapped = Math.min(POINT_TEMP_MAX_C, Math.max(POINT_TEMP_MIN_C, snapToStep(target, TEMP_STEP_C)));
  let index = points.findIndex((p) => p.tempC >= snapped);
  if (index === -1) index = points.length;
  const prev = points[index - 1];
  const next = points[index];
  if ((next && next.tempC - snapped < TEMP_STEP_C) || (prev && snapped - prev.tempC < TEMP_STEP_C)) {
    return { ok: false, reason: `No room for a ${noun(kind)} point at ${fmt(snapped)} °C: points must be at least ${TEMP_STEP_C} °C apart.` };
  }
  const dutyPct = Math.min(100, Math.ceil(dutyAtTemp(points, snapped) * 2) / 2);
  return { ok: true, index, point: { tempC: snapped, dutyPct } };
}

/** Whether point `index` may be removed: a curve keeps at least two points. */
export function removalRefusal(points: readonly CurvePoint[], kind: CurveKind): string | null {
  return points.length <= MIN_POINTS_PER_CURVE ? `The ${noun(kind)} curve needs at least ${MIN_POINTS_PER_CURVE} points: add one before removing this one.` : null;
}

/** How a handle is announced: "pump point 3, 45 °C, 60 %" (points counted from 1, as people count). */
export function pointValueText(kind: CurveKind, index: number, point: CurvePoint): string {
  return `${noun(kind)} point ${index + 1}, ${fmt(point.tempC)} °C, ${fmt(point.dutyPct)} %`;
}
