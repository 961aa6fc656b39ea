/** Density and specific heat of a coolant. */
export interface Coolant {
  name: string;
  /** Temperature the density and specific heat below are taken at, °C. */
  propertiesAtTempC: number;
  densityKgPerM3: number;
  specificHeatJPerKgK: number;
}

/** Water at 25 °C, 0.1 MPa: ρ = 997.05 kg/m³, c_p = 4181.3 J/kg·K (IAPWS-95 formulation, Wagner & Pruß 2002; values from memory). */
export const WATER_25C: Coolant = { name: "water", propertiesAtTempC: 25, densityKgPerM3: 997.05, specificHeatJPerKgK: 4181.3 };

/**
 * Propylene glycol / water, 30 % by mass, 20 °C: ρ ≈ 1028 kg/m³,
 * c_p ≈ 3850 J/kg·K (ASHRAE Handbook — Fundamentals, 2021 edition, ch. 31
 * "Physical Properties of Secondary Coolants (Brines)", propylene glycol tables;
 * chapter and values from memory, not checked against the text).
 */
export const PROPYLENE_GLYCOL_30: Coolant = {
  name: "propylene glycol 30 % / water",
  propertiesAtTempC: 20,
  densityKgPerM3: 1028,
  specificHeatJPerKgK: 3850,
};

/** Coolants selectable by key (CLI `--coolant`). */
export const COOLANTS = { water: WATER_25C, pg30: PROPYLENE_GLYCOL_30 } as const;

/**
 * Temperature rise of the coolant across the cold plate, ΔT = Q / (ṁ·c_p) with
 * ṁ = ρ·V̇ and V̇ in m³/s = L/min / 60,000 (steady-flow energy balance; Incropera &
 * DeWitt, "Fundamentals of Heat and Mass Transfer", 6th edition, §1.3.1 — section from
 * memory). Infinity at zero flow.
 */
export function coolantRiseK(heatW: number, flowLpm: number, coolant: Coolant = WATER_25C): number {
  const massFlowKgPerS = (coolant.densityKgPerM3 * flowLpm) / 60_000;
  if (!(massFlowKgPerS > 0)) return heatW > 0 ? Infinity : 0;
  return heatW / (massFlowKgPerS * coolant.specificHeatJPerKgK);
}

/** Pump flow at a speed: V̇ ∝ N (fan/pump affinity law), from flow at max RPM. */
export function pumpFlowLpm(flowAtMaxRpmLpm: number, maxRpm: number, rpm: number): number {
  if (!(maxRpm > 0) || !(rpm > 0)) return 0;
  return (flowAtMaxRpmLpm * rpm) / maxRpm;
}
