import { EngineInputError } from "../guards/input-error";
import type { HardwareContext, MotorComponent } from "../hardware/types";
import type { CurveSettings, ProfileSettings } from "../profile/types";
import { dutyAtTemp } from "../speeds/curve";
import { dutyToRpm } from "../speeds/rpm";

/** One sample of a liquid temperature trace; `tempC: null` means the sensor reads open or shorted. */
export interface TraceSample {
  tSec: number;
  tempC: number | null;
}

/** What one motor group does at one sample. */
export interface TransientMotor {
  /** Temperature the curve is read at after hysteresis, °C (null on sensor loss). */
  heldTempC: number | null;
  dutyPct: number;
  rpm: number;
  /** The motors stand still: 0 % out to a fan that stops at 0 % duty. */
  stopped: boolean;
}

export interface TransientSample {
  tSec: number;
  tempC: number | null;
  /** The sensor-loss duty applies: the reading has been missing for more than SENSOR_GLITCH_SAMPLES samples. */
  sensorLost: boolean;
  /** This sample had no reading and repeated the previous output (a bridged glitch). */
  glitchHeld: boolean;
  pump: TransientMotor;
  fans: TransientMotor;
}

/** Longest trace accepted, samples. */
export const MAX_TRACE_SAMPLES = 1_000_000;

/**
 * Consecutive samples without a reading that are bridged by keeping the last output
 * and state. One missing reading (an ADC read during a spike, a loose contact) must
 * neither reset the hysteresis nor cycle the fans through the sensor-loss duty and
 * back; from the next missing sample on, the sensor counts as lost. The firmware's
 * integer control law bridges the same number of ticks.
 */
export const SENSOR_GLITCH_SAMPLES = 1;

interface CurveState {
  heldC: number | null;
  dutyPct: number;
}

/**
 * Hysteresis as a play (backlash) operator: the held temperature follows a
 * rising temperature at once and a falling one only once it is more than
 * `hysteresisC` below: held = max(T, min(held, T + hysteresis)).
 */
export function applyHysteresisC(heldC: number, tempC: number, hysteresisC: number): number {
  return Math.max(tempC, Math.min(heldC, tempC + hysteresisC));
}

/** Moves `fromPct` toward `targetPct` by at most the ramp limit over `dtSec`. */
export function applyRampPct(fromPct: number, targetPct: number, dtSec: number, upPctPerSec: number, downPctPerSec: number): number {
  if (targetPct > fromPct) return Math.min(targetPct, fromPct + upPctPerSec * dtSec);
  return Math.max(targetPct, fromPct - downPctPerSec * dtSec);
}

function step(curve: CurveSettings, state: CurveState, tempC: number, critical: boolean, dtSec: number, started: boolean): void {
  const held = state.heldC === null ? tempC : applyHysteresisC(state.heldC, tempC, curve.hysteresisC);
  state.heldC = held;
  if (critical) {
    // At the critical temperature full speed is not delayed by the ramp limit.
    state.dutyPct = 100;
    return;
  }
  const target = dutyAtTemp(curve.points, held);
  state.dutyPct = started ? applyRampPct(state.dutyPct, target, dtSec, curve.rampUpPctPerSec, curve.rampDownPctPerSec) : target;
}

/** Output of one motor group; `cut` is the profile's fan stop (0 % out). Whether the motor then stands still is the component's (dutyToRpm). */
function motorOut(state: CurveState, component: MotorComponent, cut: boolean): TransientMotor {
  const dutyPct = cut ? 0 : state.dutyPct;
  const rpm = dutyToRpm(dutyPct, component);
  return { heldTempC: state.heldC, dutyPct, rpm, stopped: rpm === 0 };
}

function checkTrace(trace: readonly TraceSample[]): void {
  if (!Array.isArray(trace)) throw new EngineInputError("trace", "expected an array of { tSec, tempC } samples");
  if (trace.length > MAX_TRACE_SAMPLES) throw new EngineInputError("trace", `at most ${MAX_TRACE_SAMPLES} samples, got ${trace.length}`);
  let prev = -Infinity;
  trace.forEach((raw: unknown, i) => {
    // Callers may pass parsed JSON: check the shape rather than trust the type.
    if (typeof raw !== "object" || raw === null) throw new EngineInputError(`trace[${i}]`, "expected { tSec, tempC }");
    const s = raw as { tSec?: unknown; tempC?: unknown };
    if (typeof s.tSec !== "number" || !Number.isFinite(s.tSec)) throw new EngineInputError(`trace[${i}].tSec`, "expected a finite number of seconds");
    if (s.tSec < prev) throw new EngineInputError(`trace[${i}].tSec`, "times must not go backwards; sort the trace by tSec");
    if (s.tempC !== null && (typeof s.tempC !== "number" || !Number.isFinite(s.tempC))) {
      throw new EngineInputError(`trace[${i}].tempC`, "expected a finite °C value, or null for sensor loss");
    }
    prev = s.tSec;
  });
}

/**
 * What the firmware does over a liquid temperature trace: per curve, the
 * hysteresis play operator (applyHysteresisC), the curve duty at the held
 * temperature, then the ramp-rate limits (%/s up and down) between samples.
 * The first reading starts in steady state.
 *
 * Overrides, without ramp:
 * - at or above the critical temperature → 100 %;
 * - a missing reading (`tempC: null`) for at most SENSOR_GLITCH_SAMPLES samples
 *   after a reading keeps the previous output and state (`glitchHeld`); longer,
 *   or before any reading, → the sensor-loss duty at once and the fans run. The
 *   held temperatures are kept through both, so when readings return the
 *   hysteresis continues where it was and the duty ramps down from the
 *   sensor-loss duty instead of cycling.
 *
 * Fan stop is an immediate cut, not a ramp: the fans get 0 % while the held fan
 * temperature is below the stop temperature (so the hysteresis also keeps the
 * stop from chattering); a fan that stops at 0 % duty then stands still, one that
 * holds its minimum speed keeps turning at it (dutyToRpm). Below the lowest duty it follows, a fan's speed no
 * longer follows the duty (it holds its minimum speed or stops), so ramping the
 * duty toward 0 would not slow it any further, only delay the stop. The fan
 * duty keeps following the curve while stopped, so the fans restart at the
 * curve's duty. Throws EngineInputError on a bad trace.
 */
export function simulateTransient(profile: ProfileSettings, hw: HardwareContext, trace: readonly TraceSample[]): TransientSample[] {
  checkTrace(trace);
  const pump: CurveState = { heldC: null, dutyPct: 0 };
  const fans: CurveState = { heldC: null, dutyPct: 0 };
  const out: TransientSample[] = [];
  let started = false;
  let missing = 0;
  let prevT = trace[0]?.tSec ?? 0;
  for (const s of trace) {
    const dt = s.tSec - prevT;
    prevT = s.tSec;
    const last = out[out.length - 1];
    if (s.tempC === null) {
      missing++;
      if (last && !last.sensorLost && missing <= SENSOR_GLITCH_SAMPLES) {
        out.push({ ...last, tSec: s.tSec, tempC: null, glitchHeld: true });
        continue;
      }
      // Sensor lost: the fallback duty at once, no ramp (the liquid may be hot).
      pump.dutyPct = profile.sensorLossDutyPct;
      fans.dutyPct = profile.sensorLossDutyPct;
      started = true;
      out.push({ tSec: s.tSec, tempC: null, sensorLost: true, glitchHeld: false, pump: motorOut(pump, hw.pump, false), fans: motorOut(fans, hw.fan, false) });
      continue;
    }
    missing = 0;
    const critical = s.tempC >= profile.criticalTempC;
    step(profile.pump, pump, s.tempC, critical, dt, started);
    step(profile.fans, fans, s.tempC, critical, dt, started);
    started = true;
    const stopC = profile.fans.stopBelowTempC;
    const fansStopped = !critical && stopC !== undefined && fans.heldC !== null && fans.heldC < stopC;
    out.push({ tSec: s.tSec, tempC: s.tempC, sensorLost: false, glitchHeld: false, pump: motorOut(pump, hw.pump, false), fans: motorOut(fans, hw.fan, fansStopped) });
  }
  return out;
}
