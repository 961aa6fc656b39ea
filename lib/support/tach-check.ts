/**
 * What a converted tach speed says about the pump, against its datasheet range.
 * Motor speeds spread about ±10 % around the datasheet figures (common practice for
 * small BLDC pumps and fans, no published standard), so only speeds beyond that are flagged.
 */
export const TACH_TOLERANCE = 0.1;

export type TachFinding =
  | { kind: "ok" }
  | { kind: "stopped"; message: string }
  | { kind: "below_min"; message: string }
  | { kind: "above_max"; message: string };

const rpm = (n: number): string => `${Math.round(n).toLocaleString("en")} RPM`;

/** Flags a real pump speed below its lowest running speed (failing pump) or above its maximum (wrong pulses per revolution). */
export function checkPumpSpeed(realRpm: number, pump: { rpmAtMinDuty: number; maxRpm: number }, pulsesPerRev: number): TachFinding {
  if (realRpm === 0) {
    return { kind: "stopped", message: "A reading of 0 means no tach pulses: the pump is stopped, stalled or its tach wire is not connected. A pump must never stop while the CPU makes heat; check it now." };
  }
  if (realRpm < pump.rpmAtMinDuty * (1 - TACH_TOLERANCE)) {
    return {
      kind: "below_min",
      message: `${rpm(realRpm)} is below the pump's lowest running speed (${rpm(pump.rpmAtMinDuty)} at its minimum duty): the pump may be failing or blocked. Ask for the liquid temperature and a check of the pump.`,
    };
  }
  if (realRpm > pump.maxRpm * (1 + TACH_TOLERANCE)) {
    return {
      kind: "above_max",
      message: `${rpm(realRpm)} is above the pump's maximum ${rpm(pump.maxRpm)}, which a pump cannot run: the pulses per revolution (${pulsesPerRev}) are probably wrong. Check the motor's datasheet value.`,
    };
  }
  return { kind: "ok" };
}
