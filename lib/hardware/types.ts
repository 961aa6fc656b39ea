/**
 * TypeScript shape of `schemas/hardware-context.schema.json`.
 */

/** A fan or pump model. */
export interface MotorComponent {
  name?: string;
  kind: "fan" | "pump";
  minDutyPct: number;
  rpmAtMinDuty: number;
  maxRpm: number;
  tachPulsesPerRev: number;
  soundRefDbA: number;
  soundRefRpm: number;
  /** k in L = Lref + k·log10(N/Nref); 50 when left out. */
  soundExponent?: number;
  /** Required for pumps. */
  flowAtMaxRpmLpm?: number;
}

export interface PumpComponent extends MotorComponent {
  kind: "pump";
  flowAtMaxRpmLpm: number;
}

export interface RadiatorThermal {
  thermalResistanceAtMinFanKPerW: number;
  thermalResistanceAtMaxFanKPerW: number;
  thermalResistanceFansStoppedKPerW?: number;
}

export interface BoardRevision {
  version: string;
  memoryBytes: number;
  baseAddress: number;
  slotCount: number;
  maxPointsPerCurve: number;
  pwmFrequencyHz: number;
  tachPulsesPerRev: number;
}

/** The cooler a profile is evaluated for. */
export interface HardwareContext {
  $schema?: string;
  name?: string;
  fan: MotorComponent;
  fanCount: number;
  pump: PumpComponent;
  radiator: RadiatorThermal;
  boardRevision: BoardRevision;
}

/** Fan-law sound exponent used when a component does not give one. */
export const DEFAULT_SOUND_EXPONENT = 50;

/**
 * Radiator resistance with fans stopped, as a multiple of the value at minimum
 * fan speed, when the hardware context does not give it. An assumption of this
 * tool (natural convection through a dense fin stack is several times worse
 * than forced flow), not a published figure: give the measured value instead.
 */
export const DEFAULT_STOPPED_RESISTANCE_FACTOR = 3;
