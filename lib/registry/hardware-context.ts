import type { BoardRevision as EngineBoardRevision, HardwareContext, MotorComponent, SoundTable } from "@/lib/engine";
import type { RevisionNumberKey } from "./revision-fields";

/** The registry's fields the engine needs; plain objects, so client and server can both map them. */
export interface ComponentFields {
  name: string;
  kind: "fan" | "pump";
  minDutyPct: number;
  rpmAtMinDuty: number;
  maxRpm: number;
  tachPulsesPerRev: number;
  refSoundDbA: number;
  refRpm: number;
  soundExponent: number;
  /** Measured RPM → dB(A) at a stated distance; null when only the reference level and exponent are known. */
  soundTable: SoundTable | null;
  /** True: stops at 0 % duty; false: keeps its minimum speed below the minimum duty. */
  stopsAtZeroDuty: boolean;
  flowAtMaxRpmLpm: number | null;
}

export interface CoolerFields {
  name: string;
  /** Nominal radiator length, mm: taken as about its largest dimension for the near-field limit of noise estimates. */
  radiatorMm: number;
  fanCount: number;
  radiatorKPerWAtMinFan: number;
  radiatorKPerWAtMaxFan: number;
}

/** A board revision's version and its numbers (./revision-fields lists them with their units). */
export interface RevisionFields extends Record<RevisionNumberKey, number> {
  revision: string;
}

export function toEngineComponent(c: ComponentFields): MotorComponent {
  return {
    name: c.name,
    kind: c.kind,
    minDutyPct: c.minDutyPct,
    rpmAtMinDuty: c.rpmAtMinDuty,
    maxRpm: c.maxRpm,
    tachPulsesPerRev: c.tachPulsesPerRev,
    soundRefDbA: c.refSoundDbA,
    soundRefRpm: c.refRpm,
    soundExponent: c.soundExponent,
    stopsAtZeroDuty: c.stopsAtZeroDuty,
    ...(c.soundTable !== null ? { soundTable: c.soundTable } : {}),
    ...(c.flowAtMaxRpmLpm !== null ? { flowAtMaxRpmLpm: c.flowAtMaxRpmLpm } : {}),
  };
}

export function toEngineRevision(r: RevisionFields): EngineBoardRevision {
  return {
    version: r.revision,
    memoryBytes: r.memoryBytes,
    baseAddress: r.baseAddress,
    slotCount: r.slotCount,
    maxPointsPerCurve: r.maxPointsPerCurve,
    pwmFrequencyHz: r.pwmFrequencyHz,
    tachPulsesPerRev: r.tachPulsesPerRev,
  };
}

/** The hardware a profile is evaluated against: a cooler model's parts on one board revision. */
export function toHardwareContext(input: { cooler: CoolerFields; fan: ComponentFields; pump: ComponentFields; revision: RevisionFields }): HardwareContext {
  const pump = toEngineComponent(input.pump);
  return {
    name: `${input.cooler.name} on board ${input.revision.revision}`,
    fan: toEngineComponent(input.fan),
    fanCount: input.cooler.fanCount,
    pump: { ...pump, kind: "pump", flowAtMaxRpmLpm: input.pump.flowAtMaxRpmLpm ?? 1 },
    radiator: {
      largestDimensionMm: input.cooler.radiatorMm,
      thermalResistanceAtMinFanKPerW: input.cooler.radiatorKPerWAtMinFan,
      thermalResistanceAtMaxFanKPerW: input.cooler.radiatorKPerWAtMaxFan,
    },
    boardRevision: toEngineRevision(input.revision),
  };
}
