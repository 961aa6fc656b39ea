/**
 * TypeScript shape of `schemas/hardware-context.schema.json`.
 */

/** One measured point of a sound table: the A-weighted level of one unit at a speed. */
export interface SoundTablePoint {
  rpm: number;
  soundDbA: number;
}

/**
 * Levels of one unit measured at several speeds, at the stated distance (free field,
 * far enough from the unit to be out of its own near field). Preferred over the
 * reference level and exponent when given (lib/acoustics/sound-table.ts).
 */
export interface SoundTable {
  /** Microphone distance the levels were measured at, m. */
  distanceM: number;
  /** At least two points with strictly increasing RPM. */
  points: SoundTablePoint[];
}

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
  /** k in L = Lref + k·log10(N/Nref); 50 when left out. Only used without a sound table. */
  soundExponent?: number;
  /** Measured levels over speed; when given, the reference level and exponent are not used. */
  soundTable?: SoundTable;
  /**
   * What the motor does at 0 % duty (Intel, "4-Wire Pulse Width Modulation (PWM)
   * Controlled Fans", rev. 1.3, §3.4 allows both): false (the default) — it keeps its
   * minimum speed at every duty below the minimum duty, 0 % included; true — it stops
   * at 0 % duty and keeps its minimum speed between 0 % and the minimum duty.
   */
  stopsAtZeroDuty?: boolean;
  /** Required for pumps. */
  flowAtMaxRpmLpm?: number;
}

export interface PumpComponent extends MotorComponent {
  kind: "pump";
  flowAtMaxRpmLpm: number;
}

export interface RadiatorThermal {
  /** Largest outside dimension of the radiator with its fans, mm: the near field of the cooler ends at about this distance. */
  largestDimensionMm?: number;
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

/**
 * Largest dimension assumed for the near-field check when the hardware context gives
 * none: 480 mm, the longest radiator commonly fitted to all-in-one coolers (an
 * assumption of this tool, chosen so that the check errs on the safe side).
 */
export const DEFAULT_LARGEST_DIMENSION_MM = 480;

/** Fan-law sound exponent used when a component does not give one. */
export const DEFAULT_SOUND_EXPONENT = 50;

/**
 * Radiator resistance with fans stopped, as a multiple of the value at minimum
 * fan speed, when the hardware context does not give it. An assumption of this
 * tool (natural convection through a dense fin stack is several times worse
 * than forced flow), not a published figure: give the measured value instead.
 */
export const DEFAULT_STOPPED_RESISTANCE_FACTOR = 3;
