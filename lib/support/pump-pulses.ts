/**
 * Pulses per revolution assumed for a pump's tach when the registry gives none.
 * Common practice, no published source: pump motors of this trade often give 4
 * pulses per revolution, so a host that assumes the fan standard (2) shows twice
 * the real speed.
 */
export const DEFAULT_PUMP_PULSES_PER_REV = 4;

/** The pump's pulses per revolution: the registry's value when it has one, else the common-practice default. */
export function pumpPulsesPerRev(registryValue: number | null | undefined): number {
  return registryValue && registryValue >= 1 ? registryValue : DEFAULT_PUMP_PULSES_PER_REV;
}
