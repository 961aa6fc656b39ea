import { requireFinite } from "../guards/input-error";

/**
 * Pulses per revolution of a 4-wire PWM fan's tach output (Intel, "4-Wire Pulse
 * Width Modulation (PWM) Controlled Fans Specification", Rev 1.3, §2.1.3).
 */
export const STANDARD_TACH_PULSES_PER_REV = 2;

/**
 * Speed from tach frequency: RPM = 60·f / p (p = 2 for a 4-wire PWM fan, Intel
 * 4-Wire PWM fan spec rev 1.3 §2.1.3: 50 Hz → 1,500 RPM).
 */
export function rpmFromTachHz(tachHz: number, pulsesPerRev = STANDARD_TACH_PULSES_PER_REV): number {
  requireFinite("tachHz", tachHz, 0);
  requireFinite("pulsesPerRev", pulsesPerRev, 1, 64);
  return (60 * tachHz) / pulsesPerRev;
}

/** Speed from the time between two tach pulses: RPM = 60,000 / (period ms · p). */
export function rpmFromPulsePeriodMs(periodMs: number, pulsesPerRev = STANDARD_TACH_PULSES_PER_REV): number {
  requireFinite("periodMs", periodMs, Number.MIN_VALUE);
  requireFinite("pulsesPerRev", pulsesPerRev, 1, 64);
  return 60_000 / (periodMs * pulsesPerRev);
}

/**
 * Real speed of a motor that gives `motorPulsesPerRev` pulses per revolution,
 * from a reading taken by a host that assumes `hostPulsesPerRev` (2 by the
 * 4-wire fan spec): real = reading × host / motor, i.e. reading × 2 / p. A
 * 4-pulse pump read as a fan shows twice its real speed (common practice).
 */
export function realRpmFromReading(readingRpm: number, motorPulsesPerRev: number, hostPulsesPerRev = STANDARD_TACH_PULSES_PER_REV): number {
  requireFinite("readingRpm", readingRpm, 0);
  requireFinite("motorPulsesPerRev", motorPulsesPerRev, 1, 64);
  requireFinite("hostPulsesPerRev", hostPulsesPerRev, 1, 64);
  return (readingRpm * hostPulsesPerRev) / motorPulsesPerRev;
}

/** The reading a host assuming `hostPulsesPerRev` shows for a real speed: real × p / host. */
export function readingFromRealRpm(realRpm: number, motorPulsesPerRev: number, hostPulsesPerRev = STANDARD_TACH_PULSES_PER_REV): number {
  requireFinite("realRpm", realRpm, 0);
  requireFinite("motorPulsesPerRev", motorPulsesPerRev, 1, 64);
  requireFinite("hostPulsesPerRev", hostPulsesPerRev, 1, 64);
  return (realRpm * motorPulsesPerRev) / hostPulsesPerRev;
}
