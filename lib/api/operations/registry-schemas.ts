import { z } from "zod";
import { isValidRange, isValidVersion } from "@/lib/versioning/semver-helpers";
import { timestamp } from "./timestamp";
import type { ComponentFields, CoolerFields, RevisionFields } from "@/lib/registry/hardware-context";
import { REVISION_NUMBER_FIELDS, REVISION_NUMBER_KEYS, REVISION_TEXT_FIELDS, type RevisionNumberField, type RevisionNumberKey } from "@/lib/registry/revision-fields";

/** Request and view schemas of the hardware registry; forms use the same ones as the API. */

const num = (label: string) => z.number(`Enter ${label} as a number.`);
const name = z.string().trim().min(1, "Enter a name.").max(120, "Use at most 120 characters.");

/**
 * A measured sound table: levels of one unit at rising speeds, at one distance
 * (the same limits as schemas/hardware-context.schema.json).
 */
export const soundTableBody = z
  .strictObject({
    distanceM: num("the measurement distance").min(0.1, "At least 0.1 m.").max(10, "At most 10 m."),
    points: z
      .array(
        z.strictObject({
          rpm: num("the RPM").gt(0, "Above 0 RPM.").max(20000, "At most 20,000 RPM."),
          soundDbA: num("the level").min(0, "At least 0 dB(A).").max(120, "At most 120 dB(A)."),
        }),
        "Enter the measured points.",
      )
      .min(2, "Give at least 2 measured points (RPM and dB(A)).")
      .max(64, "Give at most 64 measured points."),
  })
  .refine((t) => t.points.every((p, i) => i === 0 || p.rpm > t.points[i - 1]!.rpm), { path: ["points"], message: "List the measurements by rising RPM, one per speed." });

export const componentBody = z
  .strictObject({
    kind: z.enum(["fan", "pump"], "Pick fan or pump."),
    name,
    minDutyPct: num("the minimum duty").min(0, "At least 0 %.").max(100, "At most 100 %."),
    rpmAtMinDuty: num("the RPM at minimum duty").int("Whole RPM.").min(1, "At least 1 RPM.").max(20000, "At most 20,000 RPM."),
    maxRpm: num("the maximum RPM").int("Whole RPM.").min(1, "At least 1 RPM.").max(20000, "At most 20,000 RPM."),
    tachPulsesPerRev: num("the tach pulses").int("A whole number.").min(1, "At least 1.").max(12, "At most 12."),
    refSoundDbA: num("the reference sound level").min(0, "At least 0 dB(A).").max(90, "At most 90 dB(A)."),
    refRpm: num("the reference RPM").int("Whole RPM.").min(1, "At least 1 RPM.").max(20000, "At most 20,000 RPM."),
    soundExponent: num("the sound exponent").min(10, "At least 10.").max(100, "At most 100."),
    /** Measured levels over speed; preferred over the reference level and exponent. Left out or null: none. */
    soundTable: soundTableBody.nullable().optional(),
    /** True: the motor stops at 0 % duty; false or left out: it keeps its minimum speed below the minimum duty. */
    stopsAtZeroDuty: z.boolean("Say whether the motor stops at 0 % duty.").optional(),
    flowAtMaxRpmLpm: num("the flow").gt(0, "Above 0 L/min.").max(50, "At most 50 L/min.").nullable(),
  })
  .refine((c) => c.maxRpm > c.rpmAtMinDuty, { path: ["maxRpm"], message: "The maximum RPM must be above the RPM at minimum duty." })
  .refine((c) => c.kind !== "pump" || c.flowAtMaxRpmLpm !== null, { path: ["flowAtMaxRpmLpm"], message: "A pump needs its flow at maximum RPM." });
export type ComponentBody = z.infer<typeof componentBody>;

/** A fan or pump's figures as the engine reads them. */
export const componentFieldsView = z.object({
  name: z.string(),
  kind: z.enum(["fan", "pump"]),
  minDutyPct: z.number(),
  rpmAtMinDuty: z.number(),
  maxRpm: z.number(),
  tachPulsesPerRev: z.number(),
  refSoundDbA: z.number(),
  refRpm: z.number(),
  soundExponent: z.number(),
  soundTable: z.object({ distanceM: z.number(), points: z.array(z.object({ rpm: z.number(), soundDbA: z.number() })) }).nullable(),
  stopsAtZeroDuty: z.boolean(),
  flowAtMaxRpmLpm: z.number().nullable(),
}) satisfies z.ZodType<ComponentFields>;

export const componentView = componentFieldsView.extend({ id: z.string(), createdAt: timestamp, updatedAt: timestamp });
export type ComponentView = z.infer<typeof componentView>;

export const coolerModelBody = z
  .strictObject({
    name,
    radiatorMm: num("the radiator length").int("Whole millimetres.").min(60, "At least 60 mm.").max(560, "At most 560 mm."),
    fanComponentId: z.uuid("Pick a fan."),
    fanCount: num("the fan count").int("A whole number.").min(1, "At least 1 fan.").max(12, "At most 12 fans."),
    pumpComponentId: z.uuid("Pick a pump."),
    boardModelId: z.uuid("Pick a board model."),
    radiatorKPerWAtMinFan: num("the resistance").gt(0, "Above 0 K/W.").max(5, "At most 5 K/W."),
    radiatorKPerWAtMaxFan: num("the resistance").gt(0, "Above 0 K/W.").max(5, "At most 5 K/W."),
  })
  .refine((c) => c.radiatorKPerWAtMinFan >= c.radiatorKPerWAtMaxFan, {
    path: ["radiatorKPerWAtMaxFan"],
    message: "Faster fans cool better: the resistance at maximum fan speed must not exceed the one at minimum.",
  });
export type CoolerModelBody = z.infer<typeof coolerModelBody>;

export const coolerModelView = z.object({
  id: z.string(),
  name: z.string(),
  radiatorMm: z.number(),
  fanComponentId: z.string(),
  fanName: z.string(),
  fanCount: z.number(),
  pumpComponentId: z.string(),
  pumpName: z.string(),
  boardModelId: z.string(),
  boardModelName: z.string(),
  radiatorKPerWAtMinFan: z.number(),
  radiatorKPerWAtMaxFan: z.number(),
  profileCount: z.number(),
});
export type CoolerModelView = z.infer<typeof coolerModelView>;

export const boardModelBody = z.strictObject({
  name,
  serialPrefix: z.string().trim().regex(/^[A-Z0-9]{2,8}$/, "Use 2–8 capital letters or digits, e.g. TC1."),
  description: z.string().trim().max(500, "Use at most 500 characters."),
});
export type BoardModelBody = z.infer<typeof boardModelBody>;

/** One schema per board-revision number, built from that number's definition. */
function revisionNumbers<S extends z.ZodType>(schema: (f: RevisionNumberField) => S): Record<RevisionNumberKey, S> {
  return Object.fromEntries(REVISION_NUMBER_KEYS.map((k) => [k, schema(REVISION_NUMBER_FIELDS[k])])) as Record<RevisionNumberKey, S>;
}

export const boardRevisionBody = z.strictObject({
  revision: z.string().trim().refine((v) => isValidVersion(v), "Use a semantic version such as 2.1.0."),
  ...revisionNumbers((f) => num(f.noun).int(f.wholeMessage).min(f.min, f.minMessage).max(f.max, f.maxMessage)),
  notes: z.string().trim().max(REVISION_TEXT_FIELDS.notes.maxChars, `Use at most ${REVISION_TEXT_FIELDS.notes.maxChars} characters.`),
});
export type BoardRevisionBody = z.infer<typeof boardRevisionBody>;

/** A board revision's limits as the engine reads them. */
export const revisionFieldsView = z.object({
  revision: z.string(),
  ...revisionNumbers(() => z.number()),
}) satisfies z.ZodType<RevisionFields>;

export const boardRevisionView = revisionFieldsView.extend({ id: z.string(), boardModelId: z.string(), notes: z.string() });
export type BoardRevisionView = z.infer<typeof boardRevisionView>;

export const boardModelView = z.object({
  id: z.string(),
  name: z.string(),
  serialPrefix: z.string(),
  description: z.string(),
  revisions: z.array(boardRevisionView),
});
export type BoardModelView = z.infer<typeof boardModelView>;

/** A semver range such as ">=1.1.0 <3.0.0"; validated with the same rules the compatibility check uses. */
export const boardRangeSchema = z
  .string()
  .trim()
  .min(1, "Enter a board revision range such as >=1.1.0.")
  .max(200, "Use at most 200 characters.")
  .refine((v) => isValidRange(v), 'Not a valid version range; write e.g. ">=1.1.0 <3.0.0".');

export const listQuery = <S extends readonly [string, ...string[]]>(sorts: S) =>
  z.strictObject({
    q: z.string().trim().max(120).optional(),
    sort: z.enum(sorts).optional(),
    dir: z.enum(["asc", "desc"]).default("asc"),
    page: z.coerce.number().int().min(1).max(100000).default(1),
    pageSize: z.coerce.number().int().min(1).max(100).default(20),
  });

export const pageOf = <T extends z.ZodType>(item: T) => z.object({ items: z.array(item), total: z.number(), page: z.number(), pageSize: z.number() });


export const coolerFieldsView = z.object({ name: z.string(), radiatorMm: z.number(), fanCount: z.number(), radiatorKPerWAtMinFan: z.number(), radiatorKPerWAtMaxFan: z.number() }) satisfies z.ZodType<CoolerFields>;

