import { z } from "zod";
import { defineOperation, fileResponse } from "../operation";
import { lotInput } from "@/lib/lots/input";
import { STAGE_ORDER } from "@/lib/release/stages";
import type { DumpReport } from "@/lib/engine";
import { idParams } from "./account";
import { timestamp } from "./timestamp";
import { coolingProfileDocument, profileChangeView } from "./profile-schemas";
import { componentFieldsView, coolerFieldsView, revisionFieldsView } from "./registry-schemas";
import { MAX_LOTS_CSV_BYTES, MAX_DUMP_BYTES } from "../limits";

export const lotBody = lotInput;

const stage = z.enum(STAGE_ORDER);

export const lotView = z.object({
  id: z.string(),
  lotCode: z.string(),
  serialFrom: z.string(),
  serialTo: z.string(),
  boards: z.number(),
  producedOn: z.string(),
  line: z.string(),
  boardModelName: z.string(),
  revision: z.string(),
  buildId: z.string(),
  buildVersion: z.string(),
  buildStage: stage,
});
export type LotView = z.infer<typeof lotView>;

export const lotsQuery = z.strictObject({
  board: z.uuid("Not a valid board model id.").optional(),
  build: z.uuid("Not a valid build id.").optional(),
  code: z.string().max(40).optional(),
  sort: z.enum(["serial", "produced", "code"]).default("serial"),
  dir: z.enum(["asc", "desc"]).default("asc"),
  page: z.coerce.number().int().min(1).max(100000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type LotsQuery = z.infer<typeof lotsQuery>;

export const listLots = defineOperation({
  id: "listLots",
  method: "GET",
  path: "/api/v1/lots",
  summary: "Production lots, filtered, sorted and paged",
  tag: "Support",
  access: "read",
  query: lotsQuery,
  response: z.object({ items: z.array(lotView), page: z.number(), pageSize: z.number(), hasMore: z.boolean() }),
});

export const createLot = defineOperation({
  id: "createLot",
  method: "POST",
  path: "/api/v1/lots",
  summary: "Record a production lot (factory stations use an API token)",
  tag: "Support",
  access: "lot:write",
  body: lotBody,
  response: z.object({ lot: lotView }),
  successStatus: 201,
});

export const lotOptionsView = z.object({
  boardModels: z.array(
    z.object({
      id: z.string(),
      name: z.string(),
      serialPrefix: z.string(),
      revisions: z.array(z.string()),
      builds: z.array(z.object({ id: z.string(), version: z.string(), stage, revisionRange: z.string() })),
    }),
  ),
});
export type LotOptions = z.infer<typeof lotOptionsView>;

export const getLotOptions = defineOperation({
  id: "getLotOptions",
  method: "GET",
  path: "/api/v1/lots/options",
  summary: "Board models, revisions and released builds a lot may name",
  tag: "Support",
  access: "read",
  response: lotOptionsView,
});

export { MAX_LOTS_CSV_BYTES };

export const importQuery = z.strictObject({ dryRun: z.enum(["true", "false"]).default("true") });

export const importResult = z.object({
  dryRun: z.boolean(),
  checked: z.number(),
  committed: z.number(),
  issues: z.array(z.object({ row: z.number(), column: z.string(), message: z.string() })),
});
export type ImportResult = z.infer<typeof importResult>;

export const importLots = defineOperation({
  id: "importLots",
  method: "POST",
  path: "/api/v1/lots/import",
  summary: "Import lots from CSV: dryRun=true previews, dryRun=false commits all rows or none",
  tag: "Support",
  access: "lot:write",
  query: importQuery,
  rawBody: { contentTypes: ["text/csv", "text/plain"], maxBytes: MAX_LOTS_CSV_BYTES },
  response: importResult,
});

export const importLotsWithProgress = defineOperation({
  id: "importLotsWithProgress",
  method: "POST",
  path: "/api/v1/lots/import/progress",
  summary: "Import lots from CSV as importLots does, answering with its progress: one JSON line per batch of rows checked or written, then the result (or the error) as the last line",
  tag: "Support",
  access: "lot:write",
  query: importQuery,
  rawBody: { contentTypes: ["text/csv", "text/plain"], maxBytes: MAX_LOTS_CSV_BYTES },
  response: fileResponse(
    ["application/x-ndjson"],
    'Lines of JSON: {"type":"progress","phase":"parsing"|"checking"|"writing","done":n,"total":n}, then {"type":"result","result":<importLots answer>} or {"type":"error","status":n,"body":<error body>}. Closing the connection cancels the import; nothing is recorded then.',
  ),
});

export const lookupQuery = z.strictObject({ serial: z.string().max(64, "A serial is at most 17 characters.") });

export const lookupSlotView = z.object({
  slotIndex: z.number(),
  profileVersionId: z.string(),
  profileId: z.string(),
  profileName: z.string(),
  version: z.string(),
  document: coolingProfileDocument,
  cooler: coolerFieldsView,
  fan: componentFieldsView,
  pump: componentFieldsView,
});
export type LookupSlot = z.infer<typeof lookupSlotView>;

export const lookupResultView = z.object({
  serial: z.string(),
  lot: z.object({ id: z.string(), lotCode: z.string(), serialFrom: z.string(), serialTo: z.string(), producedOn: z.string(), line: z.string() }),
  boardModel: z.object({ id: z.string(), serialPrefix: z.string() }),
  boardRevision: revisionFieldsView.extend({ id: z.string() }),
  build: z.object({ id: z.string(), version: z.string(), stage, revisionRange: z.string(), withdrawnReason: z.string().nullable() }),
  slots: z.array(lookupSlotView),
  pump: z.object({ name: z.string().nullable(), pulsesPerRev: z.number(), source: z.enum(["registry", "default"]) }),
  newerBuilds: z.array(z.object({ id: z.string(), version: z.string(), changes: z.array(profileChangeView) })),
});
export type LookupResult = z.infer<typeof lookupResultView>;

export const lookupSerial = defineOperation({
  id: "lookupSerial",
  method: "GET",
  path: "/api/v1/lookup",
  summary: "What shipped on a board: lot, revision, build and stage, curves per slot, newer builds and what changed",
  tag: "Support",
  access: "support",
  query: lookupQuery,
  response: lookupResultView,
});

export const recentLookupsView = z.object({ items: z.array(z.object({ serial: z.string(), found: z.boolean(), createdAt: z.string() })) });

export const listRecentLookups = defineOperation({
  id: "listRecentLookups",
  method: "GET",
  path: "/api/v1/lookup/recent",
  summary: "Your latest serial lookups",
  tag: "Support",
  access: "support",
  response: recentLookupsView,
});

export { MAX_DUMP_BYTES };

/** The dump report (lib/bank/dump-report.ts): the command line and this operation give the same one. */
export type { DumpReport as DumpIdentifyResult, SlotReport as DumpSlotView } from "@/lib/engine";

/** The dump report as the engine builds it; described loosely in OpenAPI until it has its own schema. */
export const dumpIdentifyView = z.custom<DumpReport>((v) => typeof v === "object" && v !== null).meta({ type: "object", description: "The dump report: file, CRC, slots matched against the registry, findings." });

export const identifyDump = defineOperation({
  id: "identifyDump",
  method: "POST",
  path: "/api/v1/dumps/identify",
  summary: "Identify a memory dump (.bin or Intel .hex) read back from a board by content: CRC, each slot exact/altered (with the differing fields)/unknown/undecodable, safety findings, the build whose bank it is, and its Ed25519 signature (signed by key K: valid / invalid, or unsigned; a .sig may come in the multipart field \"signature\")",
  tag: "Support",
  access: "support",
  rawBody: { contentTypes: ["application/octet-stream", "text/plain", "multipart/form-data"], maxBytes: MAX_DUMP_BYTES },
  response: dumpIdentifyView,
});

export const withdrawnBuildView = z.object({
  id: z.string(),
  version: z.string(),
  boardModelName: z.string(),
  withdrawnReason: z.string().nullable(),
  /** When and by whom the build was moved to withdrawn; null only for a build withdrawn without a recorded move. */
  withdrawnAt: timestamp.nullable(),
  withdrawnByName: z.string().nullable(),
  lots: z.number(),
  boards: z.number(),
});
export type WithdrawnBuildView = z.infer<typeof withdrawnBuildView>;

export const listWithdrawnBuilds = defineOperation({
  id: "listWithdrawnBuilds",
  method: "GET",
  path: "/api/v1/support/withdrawn",
  summary: "Withdrawn builds with how many boards shipped with each",
  tag: "Support",
  access: "support",
  response: z.object({ items: z.array(withdrawnBuildView) }),
});

export const shippedLotView = z.object({ lotCode: z.string(), revision: z.string(), serialFrom: z.string(), serialTo: z.string(), boards: z.number(), producedOn: z.string(), line: z.string() });
export type ShippedLotView = z.infer<typeof shippedLotView>;

export const getShippedWithBuild = defineOperation({
  id: "getShippedWithBuild",
  method: "GET",
  path: "/api/v1/support/withdrawn/{id}",
  summary: "Lots and boards that shipped with a build",
  tag: "Support",
  access: "support",
  params: idParams,
  response: z.object({
    build: z.object({ id: z.string(), version: z.string(), stage, withdrawnReason: z.string().nullable(), boardModelName: z.string() }),
    boards: z.number(),
    lots: z.array(shippedLotView),
  }),
});

export const exportShippedCsv = defineOperation({
  id: "exportShippedCsv",
  method: "GET",
  path: "/api/v1/support/withdrawn/{id}/shipped.csv",
  summary: "CSV of the lots that shipped with a build",
  tag: "Support",
  access: "support",
  params: idParams,
  response: fileResponse(["text/csv"], "One row per lot that shipped with the build"),
});
