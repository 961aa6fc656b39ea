import { MAX_DUTY_CODE } from "../bank/layout";
import type { CurveCodes, SlotCodes } from "./codes";

/*
 * The board's control law in integers only, exactly as docs/firmware-vectors.md
 * spells it out for firmware engineers. The vectors, the C reference and the
 * editor's as-flashed curve all come from these functions.
 */

/** Sensor readings are whole tenths of a degree (0.1 °C); a stored temperature code (0.5 °C) is 5 of them. */
export const DECI_C_PER_TEMP_CODE = 5;
/** Length of one control tick. The ramp codes (0.5 %/s) are then duty codes (0.5 %) per tick. */
export const TICK_MS = 1000;
/**
 * Consecutive samples without a reading that are bridged by holding the last output and
 * state: one glitch (an ADC read during a spike, a loose contact) must neither reset the
 * hysteresis nor cycle the fans through the sensor-loss duty and back. From the next
 * missing sample on the sensor counts as lost and the sensor-loss duty applies at once.
 */
export const SENSOR_GLITCH_TICKS = 1;
/** Range of a reading (int16 in the C reference); the C reference marks "no reading" with INT16_MIN. */
export const MIN_TEMP_DECI_C = -32767;
export const MAX_TEMP_DECI_C = 32767;

/**
 * Duty code of a curve at a temperature in tenths of a degree: held at the first
 * point's duty at or below it and at the last point's above it; between two points
 * linear, rounded up (toward more cooling) with integer division:
 *   span = (t_hi − t_lo)·5,  num = d_lo·span + (d_hi − d_lo)·(T − t_lo·5),
 *   duty = (num + span − 1) / span   (num ≥ 0, so this is the ceiling).
 * Points on equal temperatures (span 0) give the upper point's duty.
 */
export function curveDutyCode(curve: CurveCodes, tempDeciC: number): number {
  const points = curve.points;
  const first = points[0];
  if (first === undefined) return MAX_DUTY_CODE;
  if (tempDeciC <= first.tempCode * DECI_C_PER_TEMP_CODE) return first.dutyCode;
  for (let i = 1; i < points.length; i++) {
    const hi = points[i]!;
    const hiDeci = hi.tempCode * DECI_C_PER_TEMP_CODE;
    if (tempDeciC <= hiDeci) {
      const lo = points[i - 1]!;
      const loDeci = lo.tempCode * DECI_C_PER_TEMP_CODE;
      const span = hiDeci - loDeci;
      if (span <= 0) return hi.dutyCode;
      const num = lo.dutyCode * span + (hi.dutyCode - lo.dutyCode) * (tempDeciC - loDeci);
      return Math.floor((num + span - 1) / span);
    }
  }
  return points[points.length - 1]!.dutyCode;
}

/** Pump and fan duty codes at one steady temperature (no hysteresis or ramp history). */
export interface SteadyDuty {
  pumpDutyCode: number;
  /** 0 while the fans are stopped. */
  fanDutyCode: number;
  fansStopped: boolean;
}

const atOrAboveCritical = (codes: SlotCodes, tempDeciC: number): boolean => tempDeciC >= codes.criticalTempCode * DECI_C_PER_TEMP_CODE;
const belowFanStop = (codes: SlotCodes, tempDeciC: number): boolean => codes.fanStopTempCode !== null && tempDeciC < codes.fanStopTempCode * DECI_C_PER_TEMP_CODE;

/**
 * Steady-state duty codes at a temperature: full duty (code 200) at or above the
 * critical temperature; fans stopped (0) below the fan stop temperature; otherwise
 * each curve's `curveDutyCode`.
 */
export function steadyDutyCodes(codes: SlotCodes, tempDeciC: number): SteadyDuty {
  if (atOrAboveCritical(codes, tempDeciC)) return { pumpDutyCode: MAX_DUTY_CODE, fanDutyCode: MAX_DUTY_CODE, fansStopped: false };
  const pumpDutyCode = curveDutyCode(codes.pump, tempDeciC);
  if (belowFanStop(codes, tempDeciC)) return { pumpDutyCode, fanDutyCode: 0, fansStopped: true };
  return { pumpDutyCode, fanDutyCode: curveDutyCode(codes.fans, tempDeciC), fansStopped: false };
}

/** What one curve remembers between ticks. */
export interface CurveControlState {
  /** Temperature the curve is read at after hysteresis, 0.1 °C; null before the first reading. */
  heldDeciC: number | null;
  /** Duty code the ramp limit moves from. */
  dutyCode: number;
}

/** Output of one control tick. */
export interface TickOutput {
  pumpDutyCode: number;
  /** 0 while the fans are stopped. */
  fanDutyCode: number;
  fansStopped: boolean;
  /** The sensor-loss duty applies (the reading has been missing for more than SENSOR_GLITCH_TICKS). */
  sensorLost: boolean;
  /** This tick had no reading and repeated the previous output. */
  glitchHeld: boolean;
}

/** Everything the control law keeps between ticks (a firmware keeps the same, per slot in use). */
export interface ControlState {
  pump: CurveControlState;
  fans: CurveControlState;
  /** Consecutive ticks without a reading. */
  missingTicks: number;
  /** False until the first tick: the first output starts in steady state, without a ramp. */
  started: boolean;
  last: TickOutput | null;
}

/** The state before the first tick. */
export function initialControlState(): ControlState {
  return { pump: { heldDeciC: null, dutyCode: 0 }, fans: { heldDeciC: null, dutyCode: 0 }, missingTicks: 0, started: false, last: null };
}

/**
 * Hysteresis as a play (backlash) operator in tenths of a degree: the held value
 * follows a rising temperature at once and a falling one only once it is more than
 * the hysteresis below: held = max(T, min(held, T + h)). Before the first reading
 * (or on it) held = T.
 */
export function holdDeciC(heldDeciC: number | null, tempDeciC: number, hysteresisCode: number): number {
  if (heldDeciC === null) return tempDeciC;
  return Math.max(tempDeciC, Math.min(heldDeciC, tempDeciC + hysteresisCode));
}

/** Moves a duty code toward the target by at most the ramp codes (duty codes per tick). */
export function rampDutyCode(fromCode: number, targetCode: number, rampUpCode: number, rampDownCode: number): number {
  if (targetCode > fromCode) return Math.min(targetCode, fromCode + rampUpCode);
  return Math.max(targetCode, fromCode - rampDownCode);
}

function stepCurve(curve: CurveCodes, state: CurveControlState, tempDeciC: number, critical: boolean, started: boolean): void {
  state.heldDeciC = holdDeciC(state.heldDeciC, tempDeciC, curve.hysteresisCode);
  if (critical) {
    // At the critical temperature full duty is not delayed by the ramp limit.
    state.dutyCode = MAX_DUTY_CODE;
    return;
  }
  const target = curveDutyCode(curve, state.heldDeciC);
  state.dutyCode = started ? rampDutyCode(state.dutyCode, target, curve.rampUpCode, curve.rampDownCode) : target;
}

/**
 * One control tick (TICK_MS) with a reading in tenths of a degree, or null when the
 * sensor gave none. Updates `state` and returns the duty codes to output:
 * - reading present: per curve, hold (hysteresis) → curve duty at the held value →
 *   ramp limit from the previous duty code; at or above the critical temperature
 *   code 200 at once; the fans output 0 while the held fan temperature is below the
 *   fan stop temperature (an immediate cut: a fan cannot be ramped below its minimum
 *   speed, and the hysteresis already keeps the stop from chattering), and the fan
 *   duty keeps following the curve meanwhile, so fans restart at the curve's duty;
 * - no reading for up to SENSOR_GLITCH_TICKS ticks after a reading: the previous
 *   output and state are kept unchanged;
 * - no reading for longer (or before any reading): both curves jump to the
 *   sensor-loss duty at once (no ramp), the fans run, and the held temperatures are
 *   kept, so when readings return the hysteresis continues where it was and the
 *   duty ramps down from the sensor-loss duty.
 */
export function controlTick(codes: SlotCodes, state: ControlState, tempDeciC: number | null): TickOutput {
  if (tempDeciC === null) {
    state.missingTicks++;
    if (state.last && state.missingTicks <= SENSOR_GLITCH_TICKS) {
      state.last = { ...state.last, glitchHeld: true };
      return state.last;
    }
    state.pump.dutyCode = codes.sensorLossDutyCode;
    state.fans.dutyCode = codes.sensorLossDutyCode;
    state.started = true;
    state.last = { pumpDutyCode: codes.sensorLossDutyCode, fanDutyCode: codes.sensorLossDutyCode, fansStopped: false, sensorLost: true, glitchHeld: false };
    return state.last;
  }
  state.missingTicks = 0;
  const critical = atOrAboveCritical(codes, tempDeciC);
  stepCurve(codes.pump, state.pump, tempDeciC, critical, state.started);
  stepCurve(codes.fans, state.fans, tempDeciC, critical, state.started);
  state.started = true;
  const fansStopped = !critical && state.fans.heldDeciC !== null && belowFanStop(codes, state.fans.heldDeciC);
  state.last = { pumpDutyCode: state.pump.dutyCode, fanDutyCode: fansStopped ? 0 : state.fans.dutyCode, fansStopped, sensorLost: false, glitchHeld: false };
  return state.last;
}

/** Runs `controlTick` over a trace (one reading per tick, null = none) from the initial state. */
export function runTrace(codes: SlotCodes, tempsDeciC: readonly (number | null)[]): TickOutput[] {
  const state = initialControlState();
  return tempsDeciC.map((t) => controlTick(codes, state, t));
}
