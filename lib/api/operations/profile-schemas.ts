import { z } from "zod";
import { isStoredVersion, STORED_VERSION_HINT } from "@/lib/versioning/stored-version";
import { boardRangeSchema, componentFieldsView, revisionFieldsView } from "./registry-schemas";
import { MAX_DEPTH } from "@/lib/validation/hostile";
import { jsonNestingDepth } from "@/lib/validation/text";
import type { CoolingProfile } from "@/lib/engine";
import type { ProfileChange } from "@/lib/support/curve-diff";
import { MAX_PROFILE_BYTES } from "../limits";

export { MAX_PROFILE_BYTES };

export const createProfileBody = z.strictObject({
  coolerModelId: z.uuid("Pick a cooler model."),
  name: z.string().trim().min(1, "Enter a name.").max(80, "Use at most 80 characters."),
  description: z.string().trim().max(500, "Use at most 500 characters."),
});
export type CreateProfileBody = z.infer<typeof createProfileBody>;

export const saveDraftBody = z.strictObject({
  // A draft may be unfinished JSON, but it meets the same size and depth limits as an
  // imported file; depth is counted in one pass over the characters, never by parsing.
  text: z
    .string()
    .max(MAX_PROFILE_BYTES, "The draft is larger than 256 KiB.")
    .refine((t) => new TextEncoder().encode(t).byteLength <= MAX_PROFILE_BYTES, "The draft is larger than 256 KiB.")
    // The draft is stored as typed, and PostgreSQL text cannot hold U+0000.
    .refine((t) => !t.includes("\u0000"), "The draft contains a NUL character (U+0000); remove it (in JSON write it as \\u0000 if you mean it).")
    .refine((t) => jsonNestingDepth(t, MAX_DEPTH) <= MAX_DEPTH, `The draft is nested deeper than ${MAX_DEPTH} levels; a profile needs only a few.`),
  /** The draft revision this text was based on (from the profile or the last save); a stale one gets 409. */
  baseRevision: z.number("Send the draft revision your text is based on.").int().min(0),
});
export type SaveDraftBody = z.infer<typeof saveDraftBody>;

export const publishBody = z.strictObject({
  version: z
    .string()
    .trim()
    .refine(isStoredVersion, `Use a version the board can store: ${STORED_VERSION_HINT}.`),
  changelog: z.string().trim().min(1, "Say what changed.").max(2000, "Use at most 2,000 characters."),
  boardRange: boardRangeSchema,
  text: z.string().min(1, "The document is empty.").max(MAX_PROFILE_BYTES, "The document is larger than 256 KiB."),
});
export type PublishBody = z.infer<typeof publishBody>;

export const profileSummaryView = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  coolerModelId: z.string(),
  coolerModelName: z.string(),
  ownerName: z.string(),
  latestVersion: z.string().nullable(),
  versionCount: z.number(),
  updatedAt: z.string(),
});
export type ProfileSummaryView = z.infer<typeof profileSummaryView>;

export const versionView = z.object({
  id: z.string(),
  profileId: z.string(),
  version: z.string(),
  boardRange: z.string(),
  encodedBytes: z.number(),
  crc32: z.number(),
  contentHash: z.string(),
  changelog: z.string(),
  authorName: z.string(),
  createdAt: z.string(),
});
export type VersionView = z.infer<typeof versionView>;

export const versionWithDocumentView = versionView.extend({ document: z.unknown() });
export type VersionWithDocumentView = z.infer<typeof versionWithDocumentView>;

const componentFields = componentFieldsView;

/** A cooling profile document; its full shape is schemas/cooling-profile.schema.json, checked on publish. */
export const coolingProfileDocument = z
  .custom<CoolingProfile>((v) => typeof v === "object" && v !== null && !Array.isArray(v))
  .meta({ description: "A cooling profile document as published; its shape is the cooling-profile JSON Schema (schemas/cooling-profile.schema.json).", type: "object" });

export const profileChangeView = z.object({
  profileId: z.string(),
  profileName: z.string(),
  fromVersion: z.string().nullable(),
  toVersion: z.string().nullable(),
  kind: z.enum(["changed", "unchanged", "added", "removed"]),
  changes: z.array(z.string()),
}) satisfies z.ZodType<ProfileChange>;

/** Everything the editor needs in one answer: the profile, its cooler's parts, the board's revisions, the versions. */
export const profileDetailView = z.object({
  profile: z.object({
    id: z.string(),
    name: z.string(),
    description: z.string(),
    ownerName: z.string(),
    draftText: z.string().nullable(),
    /** Set only while draftText does not pass the schema: the last draft that did, for greyed plots. */
    lastPlottableDraftText: z.string().nullable(),
    draftUpdatedAt: z.string().nullable(),
    /** Send it back as baseRevision when saving the draft. */
    draftRevision: z.number(),
  }),
  cooler: z.object({ id: z.string(), name: z.string(), radiatorMm: z.number(), fanCount: z.number(), radiatorKPerWAtMinFan: z.number(), radiatorKPerWAtMaxFan: z.number(), boardModelName: z.string() }),
  fan: componentFields,
  pump: componentFields,
  revisions: z.array(revisionFieldsView.extend({ id: z.string() })),
  versions: z.array(versionView),
});
export type ProfileDetailView = z.infer<typeof profileDetailView>;

export const compatibilityCell = z.object({ revisionId: z.string(), ok: z.boolean(), reasons: z.array(z.string()) });
export const compatibilityView = z.object({
  revisions: z.array(z.object({ id: z.string(), revision: z.string(), memoryBytes: z.number(), maxPointsPerCurve: z.number() })),
  rows: z.array(
    z.object({
      versionId: z.string(),
      profileId: z.string(),
      profileName: z.string(),
      coolerModelName: z.string(),
      version: z.string(),
      boardRange: z.string(),
      encodedBytes: z.number(),
      maxPointsPerCurve: z.number(),
      cells: z.array(compatibilityCell),
    }),
  ),
});
export type CompatibilityView = z.infer<typeof compatibilityView>;
