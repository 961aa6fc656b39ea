import type { BoardRevision, HardwareContext, MotorComponent, RadiatorThermal } from "../hardware/types";
import type { ValidationIssue } from "./types";

/**
 * Allowed PWM frequency of 4-wire fans, 21–28 kHz (target 25 kHz): Intel,
 * "4-Wire Pulse Width Modulation (PWM) Controlled Fans Specification", Rev 1.3.
 */
const PWM_MIN_HZ = 21_000;
const PWM_MAX_HZ = 28_000;

function componentRules(path: string, c: MotorComponent, kind: "fan" | "pump", out: ValidationIssue[]): void {
  if (c.kind !== kind) {
    out.push({ code: "component.wrong_kind", path: `${path}/kind`, severity: "error", message: `This slot takes a ${kind}, but the component is a ${c.kind}: use a ${kind} component.` });
  }
  if (c.rpmAtMinDuty > c.maxRpm) {
    out.push({ code: "component.rpm_order", path: `${path}/rpmAtMinDuty`, severity: "error", message: `RPM at minimum duty (${c.rpmAtMinDuty}) is above maximum RPM (${c.maxRpm}): swap or correct them.` });
  }
  if (c.minDutyPct >= 100) {
    out.push({ code: "component.min_duty_full", path: `${path}/minDutyPct`, severity: "error", message: "A minimum duty of 100 % leaves no speed control: give the lowest duty the motor follows." });
  }
  if (c.soundTable) soundTableRules(path, c, out);
}

const rpmText = (n: number): string => String(Math.round(n * 1000) / 1000);

/** A measured sound table must have rising speeds; outside its range levels are clamped, so say where that applies. */
function soundTableRules(path: string, c: MotorComponent, out: ValidationIssue[]): void {
  const points = c.soundTable?.points ?? [];
  let ordered = true;
  points.forEach((p, i) => {
    const prev = points[i - 1];
    if (prev && !(p.rpm > prev.rpm)) {
      ordered = false;
      out.push({ code: "component.sound_table_rpm_order", path: `${path}/soundTable/points/${i}/rpm`, severity: "error", message: `Sound table point ${i + 1} is at ${rpmText(p.rpm)} RPM, not above point ${i} at ${rpmText(prev.rpm)} RPM: list the measurements by rising speed, one per speed.` });
    }
  });
  const first = points[0];
  const last = points[points.length - 1];
  if (!ordered || !first || !last) return;
  if (first.rpm > c.rpmAtMinDuty) {
    out.push({ code: "component.sound_table_range", path: `${path}/soundTable/points/0/rpm`, severity: "warning", message: `The sound table starts at ${rpmText(first.rpm)} RPM, above the minimum speed ${rpmText(c.rpmAtMinDuty)} RPM: below it the level is taken as ${rpmText(first.soundDbA)} dB(A) (held, not extrapolated), which overstates it. Add a measurement at the minimum speed.` });
  }
  if (last.rpm < c.maxRpm) {
    out.push({ code: "component.sound_table_range", path: `${path}/soundTable/points/${points.length - 1}/rpm`, severity: "warning", message: `The sound table ends at ${rpmText(last.rpm)} RPM, below the maximum speed ${rpmText(c.maxRpm)} RPM: above it the level is taken as ${rpmText(last.soundDbA)} dB(A) (held, not extrapolated), which understates it. Add a measurement at full speed.` });
  }
}

/** The parts of a hardware context the rules read; each present only when it could be read. */
export type ReadableHardware = Partial<Pick<HardwareContext, "fan" | "pump" | "radiator" | "boardRevision">>;

/**
 * Semantic rules of a hardware context that passed the schema, or of the parts of
 * one that could be read (each rule runs when the parts it reads are there).
 */
export function hardwareRuleIssues(hw: HardwareContext | ReadableHardware): ValidationIssue[] {
  const out: ValidationIssue[] = [];
  if (hw.fan) componentRules("/fan", hw.fan, "fan", out);
  if (hw.pump) componentRules("/pump", hw.pump, "pump", out);
  if (hw.radiator) radiatorRules(hw.radiator, out);
  if (hw.boardRevision) boardRules(hw.boardRevision, out);
  return out;
}

function radiatorRules(r: RadiatorThermal, out: ValidationIssue[]): void {
  if (r.thermalResistanceAtMaxFanKPerW > r.thermalResistanceAtMinFanKPerW) {
    out.push({ code: "radiator.resistance_order", path: "/radiator/thermalResistanceAtMaxFanKPerW", severity: "error", message: "The resistance at maximum fan speed is above the one at minimum speed; faster fans cool better, so swap or correct them." });
  }
  if (r.thermalResistanceFansStoppedKPerW !== undefined && r.thermalResistanceFansStoppedKPerW < r.thermalResistanceAtMinFanKPerW) {
    out.push({ code: "radiator.resistance_order", path: "/radiator/thermalResistanceFansStoppedKPerW", severity: "error", message: "The resistance with fans stopped is below the one at minimum fan speed; correct it." });
  }
}

function boardRules(board: BoardRevision, out: ValidationIssue[]): void {
  const f = board.pwmFrequencyHz;
  if (f < PWM_MIN_HZ || f > PWM_MAX_HZ) {
    out.push({ code: "board.pwm_frequency_outside_fan_spec", path: "/boardRevision/pwmFrequencyHz", severity: "warning", message: `${f} Hz is outside the 21–28 kHz that 4-wire PWM fans expect (25 kHz target); check the fans follow it.` });
  }
}
