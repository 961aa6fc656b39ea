import { and, eq } from "drizzle-orm";
import type { Database } from "../client";
import { boardModels, boardRevisions, components, coolerModels } from "../schema";

/**
 * The invented demo maker "Tarnwell Thermal": two product lines (240 mm and 360 mm
 * radiators), one controller board with three revisions of different memory sizes.
 * All figures are invented for the demo; they are plausible, not measured. Both fans
 * stop at 0 % duty (the demo profiles use fan stop); the pump keeps its minimum speed.
 */
export const DEMO_COMPONENTS = [
  { kind: "fan" as const, name: "Fellwind 120 PWM fan", minDutyPct: 20, rpmAtMinDuty: 450, maxRpm: 2000, tachPulsesPerRev: 2, refSoundDbA: 33, refRpm: 2000, soundExponent: 50, soundTable: null, stopsAtZeroDuty: true, flowAtMaxRpmLpm: null },
  { kind: "fan" as const, name: "Fellwind 120 HP fan", minDutyPct: 25, rpmAtMinDuty: 600, maxRpm: 2600, tachPulsesPerRev: 2, refSoundDbA: 38, refRpm: 2600, soundExponent: 55, soundTable: null, stopsAtZeroDuty: true, flowAtMaxRpmLpm: null },
  { kind: "pump" as const, name: "Brook D3 pump", minDutyPct: 40, rpmAtMinDuty: 1400, maxRpm: 2900, tachPulsesPerRev: 4, refSoundDbA: 24, refRpm: 2900, soundExponent: 50,
    // Invented "measured" levels at 1 m: a demo stand-in for the lab table a real pump would come with.
    soundTable: { distanceM: 1, points: [{ rpm: 1400, soundDbA: 18 }, { rpm: 2200, soundDbA: 21.5 }, { rpm: 2900, soundDbA: 24 }] },
    stopsAtZeroDuty: false, flowAtMaxRpmLpm: 1.4 },
];

export const DEMO_BOARD = { name: "TC-1 cooler controller", serialPrefix: "TC1", description: "Pump-housing controller: one liquid sensor, one pump header, one fan header." };

export const DEMO_REVISIONS = [
  { revision: "1.0.0", memoryBytes: 256, baseAddress: 0x0800f000, slotCount: 2, maxPointsPerCurve: 6, pwmFrequencyHz: 25000, tachPulsesPerRev: 2, notes: "First run; small EEPROM." },
  { revision: "1.1.0", memoryBytes: 512, baseAddress: 0x0800f000, slotCount: 3, maxPointsPerCurve: 8, pwmFrequencyHz: 25000, tachPulsesPerRev: 2, notes: "Larger EEPROM." },
  { revision: "2.0.0", memoryBytes: 2048, baseAddress: 0x0801f800, slotCount: 4, maxPointsPerCurve: 16, pwmFrequencyHz: 25000, tachPulsesPerRev: 2, notes: "Profiles moved to a flash page." },
];

export async function seedHardware(db: Database) {
  for (const c of DEMO_COMPONENTS) await db.insert(components).values(c).onConflictDoNothing();
  await db.insert(boardModels).values(DEMO_BOARD).onConflictDoNothing();
  const [board] = await db.select().from(boardModels).where(eq(boardModels.name, DEMO_BOARD.name));
  if (!board) throw new Error("demo board missing");
  for (const r of DEMO_REVISIONS) await db.insert(boardRevisions).values({ ...r, boardModelId: board.id }).onConflictDoNothing();
  const byName = Object.fromEntries((await db.select().from(components)).map((c) => [c.name, c]));
  const fan = byName["Fellwind 120 PWM fan"]!;
  const fanHp = byName["Fellwind 120 HP fan"]!;
  const pump = byName["Brook D3 pump"]!;
  await db
    .insert(coolerModels)
    .values([
      { name: "Tarn 240", radiatorMm: 240, fanComponentId: fan.id, fanCount: 2, pumpComponentId: pump.id, boardModelId: board.id, radiatorKPerWAtMinFan: 0.11, radiatorKPerWAtMaxFan: 0.045 },
      { name: "Tarn 360", radiatorMm: 360, fanComponentId: fanHp.id, fanCount: 3, pumpComponentId: pump.id, boardModelId: board.id, radiatorKPerWAtMinFan: 0.08, radiatorKPerWAtMaxFan: 0.03 },
    ])
    .onConflictDoNothing();
  const revisions = await db.select().from(boardRevisions).where(and(eq(boardRevisions.boardModelId, board.id)));
  return { board, revisions, coolers: await db.select().from(coolerModels) };
}
