import { z } from "zod";
import { defineOperation, fileResponse } from "../operation";
import { timestamp } from "./timestamp";
import { idParams } from "./account";
import { STAGE_ORDER } from "@/lib/release/stages";
import { isValidRange } from "@/lib/engine";
import { isStoredVersion, STORED_VERSION_HINT } from "@/lib/versioning/stored-version";
import { UPLOAD_MAX_BYTES } from "@/lib/release/upload-check";

export const stageSchema = z.enum(STAGE_ORDER);

const fileName = z.string().min(1, "Give the file's name.").max(400);

// ── views (JSON as the client receives it) ───────────────────────────────────
const stage = stageSchema;

export const buildSummaryView = z.object({
  id: z.string(),
  boardModelId: z.string(),
  boardModel: z.string(),
  version: z.string(),
  revisionRange: z.string(),
  stage,
  authorUserId: z.string(),
  authorName: z.string(),
  authorEmail: z.string(),
  firmwareUploadId: z.string().nullable(),
  labReportUploadId: z.string().nullable(),
  measurementsUploadId: z.string().nullable(),
  bankBytes: z.number().nullable(),
  bankSha256: z.string().nullable(),
  bankCrc32: z.number().nullable(),
  /** Key id of the Ed25519 bank signature made at pilot; null while unsigned. */
  bankSignatureKeyId: z.string().nullable(),
  releaseNotes: z.string().nullable(),
  waiverReason: z.string().nullable(),
  withdrawnReason: z.string().nullable(),
  createdAt: timestamp,
  updatedAt: timestamp,
});
export type BuildListItem = z.infer<typeof buildSummaryView>;

export const uploadView = z.object({
  id: z.string(),
  /** firmware, lab_report or measurements for what builds attach. */
  kind: z.string(),
  originalName: z.string(),
  contentType: z.string(),
  sizeBytes: z.number(),
  sha256: z.string(),
  createdAt: timestamp,
});
export type UploadView = z.infer<typeof uploadView>;

const reviewView = z.object({
  id: z.string(),
  reviewerUserId: z.string(),
  reviewerName: z.string(),
  verdict: z.enum(["approve", "request_changes"]),
  comment: z.string(),
  resolvedAt: timestamp.nullable(),
  createdAt: timestamp,
  updatedAt: timestamp,
  /** Whether this review counts toward the approvals now and, if not, why. */
  standing: z.object({ counts: z.boolean(), reason: z.string().nullable() }),
});

/** A review row as written (without the reviewer's name). */
const reviewRecord = z.object({
  id: z.string(),
  buildId: z.string(),
  reviewerUserId: z.string(),
  verdict: z.enum(["approve", "request_changes"]),
  comment: z.string(),
  resolvedAt: timestamp.nullable(),
  createdAt: timestamp,
});

const transitionRecord = z.object({
  id: z.string(),
  buildId: z.string(),
  fromStage: stage,
  toStage: stage,
  actorUserId: z.string(),
  reason: z.string().nullable(),
  createdAt: timestamp,
});

const measurementComparisonView = z.object({
  liquidTempC: z.number(),
  pumpRpm: z.number(),
  fanRpm: z.number(),
  soundDbA: z.number(),
  /** The room without the cooler running, dB(A); null when the lab gave none. */
  backgroundDbA: z.number().nullable(),
  estimatedDbA: z.number(),
  /** Measured minus background, dB; null without a background level. */
  backgroundDifferenceDb: z.number().nullable(),
  /** K1 subtracted from the measured level (ISO 3744:2010 §8.2.3 background correction), dB; null when not comparable. */
  correctionDb: z.number().nullable(),
  /** The cooler's own level after background correction; null when too close to background. */
  correctedDbA: z.number().nullable(),
  /** Corrected minus estimated, dB; null when not comparable. */
  deltaDb: z.number().nullable(),
  status: z.enum(["within", "above_tolerance", "too_close_to_background"]),
  withinTolerance: z.boolean(),
});

export const buildDetailView = z.object({
  build: buildSummaryView,
  slots: z.array(
    z.object({ slotIndex: z.number(), profileVersionId: z.string(), profileId: z.string(), profileName: z.string(), coolerModel: z.string(), version: z.string(), boardRange: z.string(), encodedBytes: z.number(), contentHash: z.string() }),
  ),
  revisions: z.array(z.object({ revision: z.string(), memoryBytes: z.number(), slotCount: z.number(), baseAddress: z.number() })),
  uploads: z.object({ firmware: uploadView.nullable(), labReport: uploadView.nullable(), measurements: uploadView.nullable() }),
  reviews: z.array(reviewView),
  approvals: z.object({ counting: z.number(), required: z.number(), openChangeRequests: z.number() }),
  transitions: z.array(z.object({ id: z.string(), fromStage: stage, toStage: stage, actorName: z.string(), reason: z.string().nullable(), createdAt: timestamp })),
  comparison: z.discriminatedUnion("state", [
    z.object({ state: z.literal("none") }),
    z.object({ state: z.literal("invalid"), errors: z.array(z.string()) }),
    z.object({ state: z.literal("ok"), coolerModel: z.string(), toleranceDb: z.number(), rows: z.array(measurementComparisonView) }),
  ]),
});
export type BuildDetail = z.infer<typeof buildDetailView>;

export const buildOptionsView = z.object({
  boardModels: z.array(z.object({ id: z.string(), name: z.string() })),
  revisions: z.array(z.object({ revision: z.string(), memoryBytes: z.number(), slotCount: z.number(), maxPointsPerCurve: z.number() })),
  candidates: z.array(z.object({ id: z.string(), profileName: z.string(), coolerModel: z.string(), version: z.string(), boardRange: z.string(), encodedBytes: z.number(), createdAt: timestamp })),
});
export type BuildOptions = z.infer<typeof buildOptionsView>;

export const mailboxMessageView = z.object({ id: z.number(), fromAddress: z.string(), toAddresses: z.array(z.string()), subject: z.string(), body: z.string(), receivedAt: timestamp });
export type MailboxMessage = z.infer<typeof mailboxMessageView>;

// ── operations ───────────────────────────────────────────────────────────────
export const listBuildsQuery = z.strictObject({ stage: stageSchema.optional() });

export const listBuilds = defineOperation({
  id: "listBuilds",
  method: "GET",
  path: "/api/v1/builds",
  summary: "Builds, newest first, optionally of one stage",
  tag: "Builds",
  access: "read",
  query: listBuildsQuery,
  response: z.object({ items: z.array(buildSummaryView) }),
});

export const createBuildBody = z.strictObject({
  boardModelId: z.uuid("Pick a board model."),
  version: z.string().refine(isStoredVersion, `Give a version the board can store: ${STORED_VERSION_HINT}.`),
  revisionRange: z.string().trim().min(1, "Give the board revisions this build is for, e.g. >=1.1.0 <3.0.0.").max(200).refine(isValidRange, "Not a semver range; write e.g. >=1.1.0 <3.0.0 or ^2.0.0."),
  slots: z.array(z.uuid("Pick a profile version.")).min(1, "Put at least one profile version in a slot.").max(16, "A bank holds at most 16 slots."),
  firmwareUploadId: z.uuid("Upload the firmware image."),
});
export type CreateBuildBody = z.infer<typeof createBuildBody>;

export const createBuild = defineOperation({
  id: "createBuild",
  method: "POST",
  path: "/api/v1/builds",
  summary: "Create a draft build; the server encodes and checks its bank image",
  tag: "Builds",
  access: "build:create",
  body: createBuildBody,
  successStatus: 201,
  response: z.object({ build: z.object({ id: z.string(), version: z.string(), stage }) }),
});

export const buildOptionsQuery = z.strictObject({ boardModelId: z.uuid().optional() });

export const getBuildOptions = defineOperation({
  id: "getBuildOptions",
  method: "GET",
  path: "/api/v1/builds/options",
  summary: "Board models, and for the one named by boardModelId its revisions and the published profile versions a new build can use",
  tag: "Builds",
  access: "build:create",
  query: buildOptionsQuery,
  response: buildOptionsView,
});

export const getBuild = defineOperation({
  id: "getBuild",
  method: "GET",
  path: "/api/v1/builds/{id}",
  summary: "A build with slots, uploads, reviews, stage timeline and measured-against-estimated sound",
  tag: "Builds",
  access: "read",
  params: idParams,
  response: buildDetailView,
});

export const gateRequirementView = z.object({
  key: z.string(),
  label: z.string(),
  /** "on_promotion": supplied with the promotion itself (release notes), so it does not hold the button back. */
  state: z.enum(["met", "unmet", "on_promotion"]),
  detail: z.string(),
});

export const buildGateView = z.object({
  stage: stageSchema,
  /** The next stage on the promotion path with each requirement of its gate; null at the end. */
  next: z.object({ to: stageSchema, requirements: z.array(gateRequirementView), ready: z.boolean() }).nullable(),
  /** Whether the signed-in user may review this build now, and why not. */
  review: z.object({ mayReview: z.boolean(), reason: z.string().nullable(), ownReviewId: z.string().nullable(), ownVerdict: z.enum(["approve", "request_changes"]).nullable() }),
  mayWithdraw: z.boolean(),
});
export type BuildGateView = z.infer<typeof buildGateView>;

export const getBuildGate = defineOperation({
  id: "getBuildGate",
  method: "GET",
  path: "/api/v1/builds/{id}/gate",
  summary: "The next stage's checklist for the signed-in user, computed by the code that judges the promotion",
  tag: "Builds",
  access: "read",
  params: idParams,
  response: buildGateView,
});

export const transitionBody = z.strictObject({
  from: stageSchema,
  to: stageSchema,
  reason: z.string().trim().max(2000).optional(),
  releaseNotes: z.string().trim().max(5000).optional(),
});
export type TransitionBody = z.infer<typeof transitionBody>;

export const transitionBuild = defineOperation({
  id: "transitionBuild",
  method: "POST",
  path: "/api/v1/builds/{id}/transitions",
  summary: "Promote a build one stage (its gate is checked) or withdraw it with a reason",
  tag: "Builds",
  access: "build:create",
  params: idParams,
  body: transitionBody,
  successStatus: 201,
  response: z.object({ transition: transitionRecord }),
});

export const reviewBody = z
  .strictObject({
    verdict: z.enum(["approve", "request_changes"], "Approve or request changes."),
    comment: z.string().trim().max(2000, "Keep the comment under 2000 characters.").default(""),
  })
  .refine((b) => b.verdict === "approve" || b.comment.length > 0, { message: "Say what should change.", path: ["comment"] });
export type ReviewBody = z.input<typeof reviewBody>;

export const reviewBuild = defineOperation({
  id: "reviewBuild",
  method: "POST",
  path: "/api/v1/builds/{id}/reviews",
  summary: "Approve a build in review or request changes with a comment",
  tag: "Builds",
  access: "build:review",
  params: idParams,
  body: reviewBody,
  successStatus: 201,
  response: z.object({ review: reviewRecord }),
});

export const changeReview = defineOperation({
  id: "changeReview",
  method: "PATCH",
  path: "/api/v1/builds/{id}/reviews/{reviewId}",
  summary: "The reviewer changes their own verdict on a build in review (one review per reviewer)",
  tag: "Builds",
  access: "build:review",
  params: z.strictObject({ id: z.uuid("Not a valid id."), reviewId: z.uuid("Not a valid id.") }),
  body: reviewBody,
  response: z.object({ review: reviewRecord }),
});

export const resolveReview = defineOperation({
  id: "resolveReview",
  method: "POST",
  path: "/api/v1/builds/{id}/reviews/{reviewId}/resolve",
  summary: "The build's author marks a change request resolved",
  tag: "Builds",
  access: "build:create",
  params: z.strictObject({ id: z.uuid("Not a valid id."), reviewId: z.uuid("Not a valid id.") }),
  response: z.object({ review: reviewRecord }),
});

export const waiverBody = z.strictObject({ reason: z.string().trim().min(10, "Explain the waiver in at least 10 characters.").max(2000) });
export type WaiverBody = z.infer<typeof waiverBody>;

export const recordWaiver = defineOperation({
  id: "recordWaiver",
  method: "POST",
  path: "/api/v1/builds/{id}/waiver",
  summary: "Accept measured sound levels outside the tolerance, with a reason",
  tag: "Builds",
  access: "build:promote",
  params: idParams,
  body: waiverBody,
  response: z.object({ ok: z.literal(true) }),
});

export const evidenceQuery = z.strictObject({ kind: z.enum(["lab_report", "measurements"], "kind is lab_report or measurements."), name: fileName });

export const uploadEvidence = defineOperation({
  id: "uploadEvidence",
  method: "POST",
  path: "/api/v1/builds/{id}/evidence",
  summary: "Attach the lab report (PDF) or the measurement CSV; send the file as the raw body",
  tag: "Builds",
  access: "build:promote",
  params: idParams,
  query: evidenceQuery,
  rawBody: { contentTypes: ["application/pdf", "text/csv", "application/octet-stream"], maxBytes: UPLOAD_MAX_BYTES.lab_report },
  successStatus: 201,
  response: z.object({ upload: uploadView }),
});

export const bankQuery = z.strictObject({ format: z.enum(["bin", "hex", "sig"]).default("bin"), revision: z.string().max(40).optional() });

export const downloadBank = defineOperation({
  id: "downloadBank",
  method: "GET",
  path: "/api/v1/builds/{id}/bank",
  summary: "The build's bank image as .bin, Intel HEX at a revision's base address, or its Ed25519 signature block (.sig, from pilot on)",
  tag: "Builds",
  access: "read",
  params: idParams,
  query: bankQuery,
  response: fileResponse(["application/octet-stream", "text/plain"], "The bank image: raw bytes (.bin) or Intel HEX text"),
});

export const uploadFirmwareQuery = z.strictObject({ name: fileName });

export const uploadFirmware = defineOperation({
  id: "uploadFirmware",
  method: "POST",
  path: "/api/v1/uploads",
  summary: "Upload a firmware image (.bin or Intel HEX) for a new build; send the file as the raw body",
  tag: "Builds",
  access: "build:create",
  query: uploadFirmwareQuery,
  rawBody: { contentTypes: ["application/octet-stream", "text/plain"], maxBytes: UPLOAD_MAX_BYTES.firmware },
  successStatus: 201,
  response: z.object({ upload: uploadView }),
});

export const downloadUpload = defineOperation({
  id: "downloadUpload",
  method: "GET",
  path: "/api/v1/uploads/{id}",
  summary: "Download an uploaded file; its SHA-256 is in the x-content-sha256 header",
  tag: "Builds",
  access: "read",
  params: idParams,
  response: fileResponse(["application/pdf", "text/csv", "application/octet-stream"], "The uploaded file as stored"),
});

export const mailboxQuery = z.strictObject({ page: z.coerce.number().int().min(1).max(100000).default(1) });

export const listMailbox = defineOperation({
  id: "listMailbox",
  method: "GET",
  path: "/api/v1/mailbox",
  summary: "Messages the local fake SMTP server received",
  tag: "Admin",
  access: "admin",
  query: mailboxQuery,
  response: z.object({ items: z.array(mailboxMessageView), hasMore: z.boolean() }),
});
