import { bankBytes, DUTY_STEP_PCT, TEMP_STEP_C } from "../bank/layout";
import { dutyCode, dutyFromCode, quantiseCurve, tempCode, tempFromCode } from "../bank/quantise";
import type { HardwareContext } from "../hardware/types";
import type { CoolingProfile, CurveKind, CurveSettings, FanCurve, PumpCurve } from "../profile/types";
import { dutyAtTemp, maxDutyPct } from "../speeds/curve";
import type { ValidationIssue } from "./types";

const CURVES: readonly CurveKind[] = ["pump", "fans"];
const LABEL: Record<CurveKind, string> = { pump: "pump", fans: "fan" };
const fmt = (n: number): string => String(Math.round(n * 1000) / 1000);

const error = (code: string, path: string, message: string): ValidationIssue => ({ code, path, severity: "error", message });
const warning = (code: string, path: string, message: string): ValidationIssue => ({ code, path, severity: "warning", message });

/** Points as people count them (the first is point 1); JSON pointers in `path` stay 0-based for tools. */
const pointNo = (index: number): number => index + 1;

function orderRules(kind: CurveKind, curve: CurveSettings, out: ValidationIssue[]): void {
  curve.points.forEach((p, i) => {
    const prev = curve.points[i - 1];
    if (!prev) return;
    if (!(p.tempC > prev.tempC)) {
      out.push(error("curve.temps_not_increasing", `/${kind}/points/${i}/tempC`, `${LABEL[kind]} point ${pointNo(i)} is at ${fmt(p.tempC)} °C, not above point ${pointNo(i - 1)} at ${fmt(prev.tempC)} °C: temperatures must strictly increase; sort the points or remove the duplicate.`));
    }
    if (p.dutyPct < prev.dutyPct) {
      out.push(error("curve.duties_decreasing", `/${kind}/points/${i}/dutyPct`, `${LABEL[kind]} point ${pointNo(i)} asks for ${fmt(p.dutyPct)} %, less than the ${fmt(prev.dutyPct)} % of point ${pointNo(i - 1)}: duties must not fall as the liquid warms; raise it to at least ${fmt(prev.dutyPct)} %.`));
    }
  });
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

const readableCurves = (doc: ReadableProfile): [CurveKind, CurveSettings][] => CURVES.flatMap((k): [CurveKind, CurveSettings][] => (doc[k] ? [[k, doc[k]]] : []));

function safetyRules(doc: ReadableProfile, out: ValidationIssue[]): void {
  const critical = doc.criticalTempC;
  const curves = readableCurves(doc);
  if (critical !== undefined) {
    for (const [kind, curve] of curves) {
      const atCritical = dutyAtTemp(curve.points, critical);
      if (atCritical < 100) {
        out.push(error("curve.no_full_speed_at_critical", `/${kind}/points`, `The ${LABEL[kind]} curve reaches only ${fmt(atCritical)} % at the critical temperature ${fmt(critical)} °C: add a point with 100 % at or below ${fmt(critical)} °C.`));
      }
    }
  }
  // With one curve unreadable its duties are unknown, but a sensor-loss duty below the readable curve's highest is wrong whatever the other says.
  const highest = Math.max(...curves.map(([, c]) => maxDutyPct(c.points)));
  if (doc.sensorLossDutyPct !== undefined && curves.length > 0 && doc.sensorLossDutyPct < highest) {
    out.push(error("sensor_loss.below_curve_duty", "/sensorLossDutyPct", `The sensor-loss duty ${fmt(doc.sensorLossDutyPct)} % is below the highest curve duty ${fmt(highest)} %: with the sensor lost the liquid may be hot, so set it to at least ${fmt(highest)} % (100 % is usual).`));
  }
  doc.pump?.points.forEach((p, i) => {
    if (p.dutyPct <= 0) {
      out.push(error("pump.zero_duty", `/pump/points/${i}/dutyPct`, "A pump must never stop while the CPU makes heat: give this point a duty above 0 %, at least the pump's minimum duty."));
    }
  });
  const stop = doc.fans?.stopBelowTempC;
  if (stop !== undefined && critical !== undefined && stop >= critical) {
    out.push(error("fans.stop_at_or_above_critical", "/fans/stopBelowTempC", `The fans would stop below ${fmt(stop)} °C, at or above the critical temperature ${fmt(critical)} °C: set the stop temperature well below it.`));
  }
  if (stop !== undefined && doc.fans?.hysteresisC === 0) {
    // The held temperature decides the stop; with no band every wobble of the reading around the stop temperature starts or stops the fans.
    out.push(warning("fans.stop_without_hysteresis", "/fans/hysteresisC", `The fans stop below ${fmt(stop)} °C with no hysteresis: a reading wobbling around ${fmt(stop)} °C would stop and start them on every sample (chatter). Give the fan curve a hysteresis, e.g. 1.5 °C.`));
  }
}

function hardwareRules(doc: ReadableProfile, hw: HardwareContext, out: ValidationIssue[]): void {
  doc.pump?.points.forEach((p, i) => {
    if (p.dutyPct > 0 && p.dutyPct < hw.pump.minDutyPct) {
      out.push(error("pump.below_min_duty", `/pump/points/${i}/dutyPct`, `${fmt(p.dutyPct)} % is below the pump's minimum duty ${fmt(hw.pump.minDutyPct)} %: raise it to at least ${fmt(hw.pump.minDutyPct)} %.`));
    }
  });
  fanBelowMinDutyRules(doc, hw, out);
  const limit = hw.boardRevision.maxPointsPerCurve;
  for (const [kind, curve] of readableCurves(doc)) {
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
  fans.points.forEach((p, i) => {
    if (stops && p.dutyPct <= 0) {
      if (stopC === undefined) {
        out.push(error("fans.zero_duty_stops_fan", `/fans/points/${i}/dutyPct`, `Fan point ${pointNo(i)} asks for 0 %, and this fan stops at 0 % duty: the fans would stop at ${fmt(p.tempC)} °C without a fan stop temperature, so without its hysteresis and safety checks. Set stopBelowTempC to stop them (e.g. ${fmt(p.tempC)} °C), or give this point at least the fan's minimum duty ${fmt(hw.fan.minDutyPct)} %.`));
      } else if (p.tempC >= stopC) {
        out.push(error("fans.zero_duty_stops_fan", `/fans/points/${i}/dutyPct`, `Fan point ${pointNo(i)} asks for 0 % at ${fmt(p.tempC)} °C, at or above the fan stop temperature ${fmt(stopC)} °C, and this fan stops at 0 % duty: the fans would stop there although the stop temperature says they run. Raise this point to at least the fan's minimum duty ${fmt(hw.fan.minDutyPct)} %, or raise stopBelowTempC above ${fmt(p.tempC)} °C.`));
      }
      return;
    }
    if (p.dutyPct < hw.fan.minDutyPct) {
      const stopAdvice = stops ? "Raise it, or use stopBelowTempC to stop them." : "Raise it; this fan does not stop at 0 % duty.";
      out.push(warning("fans.below_min_duty", `/fans/points/${i}/dutyPct`, `Fan point ${pointNo(i)}: ${fmt(p.dutyPct)} % is below the fan's minimum duty ${fmt(hw.fan.minDutyPct)} %, so the fans hold their minimum ${fmt(hw.fan.rpmAtMinDuty)} RPM there. ${stopAdvice}`));
    }
  });
  if (!stops && stopC !== undefined) {
    out.push(warning("fans.stop_on_fan_that_holds_speed", "/fans/stopBelowTempC", `The fans are set to stop below ${fmt(stopC)} °C, but this fan keeps its minimum speed at 0 % duty: below ${fmt(stopC)} °C they run at ${fmt(hw.fan.rpmAtMinDuty)} RPM, not stopped. Use a fan that stops at 0 % duty, or remove stopBelowTempC.`));
  }
}

function quantisationRules(doc: ReadableProfile, out: ValidationIssue[]): void {
  for (const [kind, curve] of readableCurves(doc)) {
    const q = quantiseCurve(curve);
    curve.points.forEach((p, i) => {
      const qp = q.points[i]!;
      const prev = q.points[i - 1];
      if (prev && curve.points[i - 1]!.tempC < p.tempC && !(qp.tempC > prev.tempC)) {
        out.push(error("quantisation.temps_collide", `/${kind}/points/${i}/tempC`, `Stored in ${TEMP_STEP_C} °C steps this point falls on ${fmt(qp.tempC)} °C like the point before: space the points at least ${TEMP_STEP_C} °C apart.`));
      }
      if (qp.tempC !== p.tempC) {
        out.push(warning("quantisation.loss", `/${kind}/points/${i}/tempC`, `Stored as ${fmt(qp.tempC)} °C (${TEMP_STEP_C} °C steps, rounded down); write ${fmt(qp.tempC)} to see exactly what the board runs.`));
      }
      if (qp.dutyPct !== p.dutyPct) {
        out.push(warning("quantisation.loss", `/${kind}/points/${i}/dutyPct`, `Stored as ${fmt(qp.dutyPct)} % (${DUTY_STEP_PCT} % steps, rounded up); write ${fmt(qp.dutyPct)} to see exactly what the board runs.`));
      }
    });
    for (const field of ["hysteresisC", "rampUpPctPerSec", "rampDownPctPerSec"] as const) {
      if (q[field] !== curve[field]) {
        out.push(warning("quantisation.loss", `/${kind}/${field}`, `Stored as ${fmt(q[field])}; write that value to see exactly what the board runs.`));
      }
    }
  }
  const storedTemp = (c: number): number => tempFromCode(tempCode(c));
  const single: [string, number | undefined, (v: number) => number][] = [
    ["/criticalTempC", doc.criticalTempC, storedTemp],
    ["/sensorLossDutyPct", doc.sensorLossDutyPct, (d) => dutyFromCode(dutyCode(d))],
    ["/fans/stopBelowTempC", doc.fans?.stopBelowTempC, storedTemp],
  ];
  for (const [path, before, store] of single) {
    if (before === undefined) continue;
    const after = store(before);
    if (before !== after) out.push(warning("quantisation.loss", path, `Stored as ${fmt(after)}${path.endsWith("TempC") ? " °C" : ""}; write that value to see exactly what the board runs.`));
  }
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
  for (const [kind, curve] of readableCurves(doc)) orderRules(kind, curve, out);
  safetyRules(doc, out);
  if (hw) hardwareRules(doc, hw, out);
  quantisationRules(doc, out);
  return out;
}
