import { bankBytes, DUTY_STEP_PCT, TEMP_STEP_C } from "../bank/layout";
import * as quantise from "../bank/quantise";
import type { HardwareContext } from "../hardware/types";
import type { CoolingProfile, CurveKind, CurveSettings, FanCurve, PumpCurve } from "../profile/types";
import { dutyAtTemp, maxDutyPct } from "../speeds/curve";
import type { ValidationIssue } from "./types";

// Read once: where this file runs as CommonJS (tsx, bundlers in development) every use of an
// imported name is a getter call, and these run for every point.
const { storedDutyPct, storedHysteresisC, storedRampDownPctPerSec, storedRampUpPctPerSec, storedTempC } = quantise;

const CURVES: readonly CurveKind[] = ["pump", "fans"];
const LABEL: Record<CurveKind, string> = { pump: "pump", fans: "fan" };
const fmt = (n: number): string => String(Math.round(n * 1000) / 1000);

const error = (code: string, path: string, message: string): ValidationIssue => ({ code, path, severity: "error", message });
const warning = (code: string, path: string, message: string): ValidationIssue => ({ code, path, severity: "warning", message });

/** Points as people count them (the first is point 1); JSON pointers in `path` stay 0-based for tools. */
const pointNo = (index: number): number => index + 1;

function orderRules(kind: CurveKind, curve: CurveSettings, out: ValidationIssue[]): void {
  const points = curve.points;
  for (let i = 1; i < points.length; i++) {
    const p = points[i]!;
    const prev = points[i - 1]!;
    if (!(p.tempC > prev.tempC)) {
      out.push(error("curve.temps_not_increasing", `/${kind}/points/${i}/tempC`, `${LABEL[kind]} point ${pointNo(i)} is at ${fmt(p.tempC)} °C, not above point ${pointNo(i - 1)} at ${fmt(prev.tempC)} °C: temperatures must strictly increase; sort the points or remove the duplicate.`));
    }
    if (p.dutyPct < prev.dutyPct) {
      out.push(error("curve.duties_decreasing", `/${kind}/points/${i}/dutyPct`, `${LABEL[kind]} point ${pointNo(i)} asks for ${fmt(p.dutyPct)} %, less than the ${fmt(prev.dutyPct)} % of point ${pointNo(i - 1)}: duties must not fall as the liquid warms; raise it to at least ${fmt(prev.dutyPct)} %.`));
    }
  }
}

/**
 * The parts of a profile the rules read. Each is present only when it could be read
 * (it passed its part of the schema), so a schema error in one part does not hide the
 * rule errors of the others.
 */
export interface ReadableProfile {
  criticalTempC?: number;
  sensorLossDutyPct?: number;
  pump?: PumpCurve;
  fans?: FanCurve;
}

/** The curves that could be read, with their kind; found once per validation and handed to each rule. */
type ReadableCurves = readonly (readonly [CurveKind, CurveSettings])[];

function readableCurves(doc: ReadableProfile): ReadableCurves {
  const curves: (readonly [CurveKind, CurveSettings])[] = [];
  for (const kind of CURVES) {
    const curve = doc[kind];
    if (curve) curves.push([kind, curve]);
  }
  return curves;
}

function safetyRules(doc: ReadableProfile, curves: ReadableCurves, out: ValidationIssue[]): void {
  const critical = doc.criticalTempC;
  if (critical !== undefined) {
    for (const [kind, curve] of curves) {
      const atCritical = dutyAtTemp(curve.points, critical);
      if (atCritical < 100) {
        out.push(error("curve.no_full_speed_at_critical", `/${kind}/points`, `The ${LABEL[kind]} curve reaches only ${fmt(atCritical)} % at the critical temperature ${fmt(critical)} °C: add a point with 100 % at or below ${fmt(critical)} °C.`));
      }
    }
  }
  // With one curve unreadable its duties are unknown, but a sensor-loss duty below the readable curve's highest is wrong whatever the other says.
  let highest = -Infinity;
  for (const [, c] of curves) highest = Math.max(highest, maxDutyPct(c.points));
  if (doc.sensorLossDutyPct !== undefined && curves.length > 0 && doc.sensorLossDutyPct < highest) {
    out.push(error("sensor_loss.below_curve_duty", "/sensorLossDutyPct", `The sensor-loss duty ${fmt(doc.sensorLossDutyPct)} % is below the highest curve duty ${fmt(highest)} %: with the sensor lost the liquid may be hot, so set it to at least ${fmt(highest)} % (100 % is usual).`));
  }
  const pumpPoints = doc.pump?.points ?? [];
  for (let i = 0; i < pumpPoints.length; i++) {
    if (pumpPoints[i]!.dutyPct <= 0) {
      out.push(error("pump.zero_duty", `/pump/points/${i}/dutyPct`, "A pump must never stop while the CPU makes heat: give this point a duty above 0 %, at least the pump's minimum duty."));
    }
  }
  const stop = doc.fans?.stopBelowTempC;
  if (stop !== undefined && critical !== undefined && stop >= critical) {
    out.push(error("fans.stop_at_or_above_critical", "/fans/stopBelowTempC", `The fans would stop below ${fmt(stop)} °C, at or above the critical temperature ${fmt(critical)} °C: set the stop temperature well below it.`));
  }
  if (stop !== undefined && doc.fans?.hysteresisC === 0) {
    // The held temperature decides the stop; with no band every wobble of the reading around the stop temperature starts or stops the fans.
    out.push(warning("fans.stop_without_hysteresis", "/fans/hysteresisC", `The fans stop below ${fmt(stop)} °C with no hysteresis: a reading wobbling around ${fmt(stop)} °C would stop and start them on every sample (chatter). Give the fan curve a hysteresis, e.g. 1.5 °C.`));
  }
}

function hardwareRules(doc: ReadableProfile, curves: ReadableCurves, hw: HardwareContext, out: ValidationIssue[]): void {
  const pumpPoints = doc.pump?.points ?? [];
  for (let i = 0; i < pumpPoints.length; i++) {
    const p = pumpPoints[i]!;
    if (p.dutyPct > 0 && p.dutyPct < hw.pump.minDutyPct) {
      out.push(error("pump.below_min_duty", `/pump/points/${i}/dutyPct`, `${fmt(p.dutyPct)} % is below the pump's minimum duty ${fmt(hw.pump.minDutyPct)} %: raise it to at least ${fmt(hw.pump.minDutyPct)} %.`));
    }
  }
  fanBelowMinDutyRules(doc, hw, out);
  const limit = hw.boardRevision.maxPointsPerCurve;
  for (const [kind, curve] of curves) {
    const n = curve.points.length;
    if (n > limit) {
      out.push(error("board.too_many_points", `/${kind}/points`, `The ${LABEL[kind]} curve has ${n} points; board revision ${hw.boardRevision.version} stores at most ${limit}: remove ${n - limit}.`));
    }
  }
  if (!doc.pump || !doc.fans) return;
  const imageBytes = bankBytes([{ pumpPoints: doc.pump.points.length, fanPoints: doc.fans.points.length }]);
  if (imageBytes > hw.boardRevision.memoryBytes) {
    out.push(error("bank.exceeds_memory", "", `A bank holding this profile alone takes ${imageBytes} bytes; board revision ${hw.boardRevision.version} has ${hw.boardRevision.memoryBytes}: remove curve points.`));
  }
}

/**
 * What the fans do below their minimum duty depends on the fan (Intel, "4-Wire Pulse Width
 * Modulation (PWM) Controlled Fans", rev. 1.3, §3.4 allows both kinds; the hardware context
 * says which, `stopsAtZeroDuty`):
 * - a fan that stops at 0 % duty stops at a 0 % point. A stop the curve makes by itself
 *   bypasses the fan stop temperature — its hysteresis, and the rule that keeps it below
 *   the critical temperature — so a 0 % point is an error unless it lies below the fan
 *   stop temperature (where the fans are stopped anyway);
 * - a fan that keeps its minimum speed never stops on a 0 % output, so a fan stop
 *   temperature only lowers it to that speed: a warning, since the profile then does
 *   not do what it says.
 */
function fanBelowMinDutyRules(doc: ReadableProfile, hw: HardwareContext, out: ValidationIssue[]): void {
  const fans = doc.fans;
  if (!fans) return;
  const stops = hw.fan.stopsAtZeroDuty === true;
  const stopC = fans.stopBelowTempC;
  const points = fans.points;
  for (let i = 0; i < points.length; i++) {
    const p = points[i]!;
    if (stops && p.dutyPct <= 0) {
      if (stopC === undefined) {
        out.push(error("fans.zero_duty_stops_fan", `/fans/points/${i}/dutyPct`, `Fan point ${pointNo(i)} asks for 0 %, and this fan stops at 0 % duty: the fans would stop at ${fmt(p.tempC)} °C without a fan stop temperature, so without its hysteresis and safety checks. Set stopBelowTempC to stop them (e.g. ${fmt(p.tempC)} °C), or give this point at least the fan's minimum duty ${fmt(hw.fan.minDutyPct)} %.`));
      } else if (p.tempC >= stopC) {
        out.push(error("fans.zero_duty_stops_fan", `/fans/points/${i}/dutyPct`, `Fan point ${pointNo(i)} asks for 0 % at ${fmt(p.tempC)} °C, at or above the fan stop temperature ${fmt(stopC)} °C, and this fan stops at 0 % duty: the fans would stop there although the stop temperature says they run. Raise this point to at least the fan's minimum duty ${fmt(hw.fan.minDutyPct)} %, or raise stopBelowTempC above ${fmt(p.tempC)} °C.`));
      }
      continue;
    }
    if (p.dutyPct < hw.fan.minDutyPct) {
      const stopAdvice = stops ? "Raise it, or use stopBelowTempC to stop them." : "Raise it; this fan does not stop at 0 % duty.";
      out.push(warning("fans.below_min_duty", `/fans/points/${i}/dutyPct`, `Fan point ${pointNo(i)}: ${fmt(p.dutyPct)} % is below the fan's minimum duty ${fmt(hw.fan.minDutyPct)} %, so the fans hold their minimum ${fmt(hw.fan.rpmAtMinDuty)} RPM there. ${stopAdvice}`));
    }
  }
  if (!stops && stopC !== undefined) {
    out.push(warning("fans.stop_on_fan_that_holds_speed", "/fans/stopBelowTempC", `The fans are set to stop below ${fmt(stopC)} °C, but this fan keeps its minimum speed at 0 % duty: below ${fmt(stopC)} °C they run at ${fmt(hw.fan.rpmAtMinDuty)} RPM, not stopped. Use a fan that stops at 0 % duty, or remove stopBelowTempC.`));
  }
}

function quantisationRules(doc: ReadableProfile, curves: ReadableCurves, out: ValidationIssue[]): void {
  for (const [kind, curve] of curves) {
    const points = curve.points;
    let prevStoredTempC = Number.NaN;
    for (let i = 0; i < points.length; i++) {
      const p = points[i]!;
      const storedPointTempC = storedTempC(p.tempC);
      const storedPointDutyPct = storedDutyPct(p.dutyPct);
      if (i > 0 && points[i - 1]!.tempC < p.tempC && !(storedPointTempC > prevStoredTempC)) {
        out.push(error("quantisation.temps_collide", `/${kind}/points/${i}/tempC`, `Stored in ${TEMP_STEP_C} °C steps this point falls on ${fmt(storedPointTempC)} °C like the point before: space the points at least ${TEMP_STEP_C} °C apart.`));
      }
      if (storedPointTempC !== p.tempC) {
        out.push(warning("quantisation.loss", `/${kind}/points/${i}/tempC`, `Stored as ${fmt(storedPointTempC)} °C (${TEMP_STEP_C} °C steps, rounded down); write ${fmt(storedPointTempC)} to see exactly what the board runs.`));
      }
      if (storedPointDutyPct !== p.dutyPct) {
        out.push(warning("quantisation.loss", `/${kind}/points/${i}/dutyPct`, `Stored as ${fmt(storedPointDutyPct)} % (${DUTY_STEP_PCT} % steps, rounded up); write ${fmt(storedPointDutyPct)} to see exactly what the board runs.`));
      }
      prevStoredTempC = storedPointTempC;
    }
    settingLoss(`/${kind}/hysteresisC`, curve.hysteresisC, storedHysteresisC(curve.hysteresisC), "", out);
    settingLoss(`/${kind}/rampUpPctPerSec`, curve.rampUpPctPerSec, storedRampUpPctPerSec(curve.rampUpPctPerSec), "", out);
    settingLoss(`/${kind}/rampDownPctPerSec`, curve.rampDownPctPerSec, storedRampDownPctPerSec(curve.rampDownPctPerSec), "", out);
  }
  if (doc.criticalTempC !== undefined) settingLoss("/criticalTempC", doc.criticalTempC, storedTempC(doc.criticalTempC), " °C", out);
  if (doc.sensorLossDutyPct !== undefined) settingLoss("/sensorLossDutyPct", doc.sensorLossDutyPct, storedDutyPct(doc.sensorLossDutyPct), "", out);
  const stop = doc.fans?.stopBelowTempC;
  if (stop !== undefined) settingLoss("/fans/stopBelowTempC", stop, storedTempC(stop), " °C", out);
}

/** A single setting the stored format changes: warns with the value the board runs (the message is written only then). */
function settingLoss(path: string, before: number, after: number, unit: string, out: ValidationIssue[]): void {
  if (before !== after) out.push(warning("quantisation.loss", path, `Stored as ${fmt(after)}${unit}; write that value to see exactly what the board runs.`));
}

/**
 * Semantic rules of a profile that passed the schema: point order, safety
 * (full speed at the critical temperature, sensor-loss duty, a pump that never
 * stops, fan stop below critical), board and component limits when `hw` is
 * given, and the effects of quantisation to the stored format. Takes a whole
 * document, or only the parts of one that could be read: each rule runs when the
 * parts it reads are there.
 */
export function profileRuleIssues(doc: CoolingProfile | ReadableProfile, hw?: HardwareContext): ValidationIssue[] {
  const out: ValidationIssue[] = [];
  const curves = readableCurves(doc);
  for (const [kind, curve] of curves) orderRules(kind, curve, out);
  safetyRules(doc, curves, out);
  if (hw) hardwareRules(doc, curves, hw, out);
  quantisationRules(doc, curves, out);
  return out;
}
