import type { CoolingProfile } from "@/lib/engine";

/**
 * The first draft of a new profile: a safe, conservative curve for the cooler's
 * parts (pump never below its minimum duty, both curves at 100 % before the
 * critical temperature, sensor loss at full speed) for the engineer to shape.
 */
export function starterProfile(input: { name: string; description: string; pumpMinDutyPct: number; fanMinDutyPct: number }): CoolingProfile {
  const pumpFloor = Math.min(100, Math.ceil(input.pumpMinDutyPct));
  const fanFloor = Math.min(100, Math.ceil(input.fanMinDutyPct));
  const mid = (lo: number) => Math.min(100, Math.round((lo + 100) / 2));
  return {
    $schema: "https://loopkeeper.example/schemas/cooling-profile.schema.json",
    formatVersion: 1,
    name: input.name,
    ...(input.description ? { description: input.description } : {}),
    criticalTempC: 60,
    sensorLossDutyPct: 100,
    pump: {
      points: [
        { tempC: 25, dutyPct: pumpFloor },
        { tempC: 40, dutyPct: mid(pumpFloor) },
        { tempC: 55, dutyPct: 100 },
      ],
      hysteresisC: 2,
      rampUpPctPerSec: 10,
      rampDownPctPerSec: 3,
    },
    fans: {
      points: [
        { tempC: 25, dutyPct: fanFloor },
        { tempC: 40, dutyPct: mid(fanFloor) },
        { tempC: 55, dutyPct: 100 },
      ],
      hysteresisC: 2,
      rampUpPctPerSec: 10,
      rampDownPctPerSec: 3,
    },
  };
}

/** The editor's text of a document: two-space JSON with a final newline. */
export function documentText(doc: unknown): string {
  return `${JSON.stringify(doc, null, 2)}\n`;
}
