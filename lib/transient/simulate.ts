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
  stopped: boolean;
}

export interface TransientSample {
  tSec: number;
  tempC: number | null;
  sensorLost: boolean;
  pump: TransientMotor;
  fans: TransientMotor;
}

/** Longest trace accepted, samples. */
export const MAX_TRACE_SAMPLES = 1_000_000;

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

function step(curve: CurveSettings, profile: ProfileSettings, state: CurveState, tempC: number | null, dtSec: number, first: boolean): void {
  if (tempC === null) {
    // Sensor loss: jump to the fallback duty at once, no ramp (safety first).
    state.heldC = null;
    state.dutyPct = profile.sensorLossDutyPct;
    return;
  }
  const held = state.heldC === null || first ? tempC : applyHysteresisC(state.heldC, tempC, curve.hysteresisC);
  state.heldC = held;
  if (tempC >= profile.criticalTempC) {
    // At the critical temperature full speed is not delayed by the ramp limit.
    state.dutyPct = 100;
    return;
  }
  const target = dutyAtTemp(curve.points, held);
  state.dutyPct = first ? target : applyRampPct(state.dutyPct, target, dtSec, curve.rampUpPctPerSec, curve.rampDownPctPerSec);
}

function motorOut(state: CurveState, component: MotorComponent, stopped: boolean): TransientMotor {
  if (stopped) return { heldTempC: state.heldC, dutyPct: 0, rpm: 0, stopped: true };
  return { heldTempC: state.heldC, dutyPct: state.dutyPct, rpm: dutyToRpm(state.dutyPct, component), stopped: false };
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
 * Overrides, without ramp: sensor loss → sensor-loss duty; at or above the
 * critical temperature → 100 %. Fans stop while the held fan temperature is
 * below the stop temperature (so hysteresis also applies to fan stop). The
 * first sample starts in steady state. Throws EngineInputError on a bad trace.
 */
export function simulateTransient(profile: ProfileSettings, hw: HardwareContext, trace: readonly TraceSample[]): TransientSample[] {
  checkTrace(trace);
  const pump: CurveState = { heldC: null, dutyPct: 0 };
  const fans: CurveState = { heldC: null, dutyPct: 0 };
  const out: TransientSample[] = [];
  let prevT = 0;
  trace.forEach((s, i) => {
    const dt = i === 0 ? 0 : s.tSec - prevT;
    prevT = s.tSec;
    step(profile.pump, profile, pump, s.tempC, dt, i === 0);
    step(profile.fans, profile, fans, s.tempC, dt, i === 0);
    const stopC = profile.fans.stopBelowTempC;
    const fansStopped =
      s.tempC !== null && s.tempC < profile.criticalTempC && stopC !== undefined && fans.heldC !== null && fans.heldC < stopC;
    out.push({
      tSec: s.tSec,
      tempC: s.tempC,
      sensorLost: s.tempC === null,
      pump: motorOut(pump, hw.pump, false),
      fans: motorOut(fans, hw.fan, fansStopped),
    });
  });
  return out;
}
