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
