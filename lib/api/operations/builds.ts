import { z } from "zod";
import { defineOperation } from "../operation";
import { idParams } from "./account";
import { STAGE_ORDER } from "@/lib/release/stages";
import { isValidRange } from "@/lib/engine";
import { UPLOAD_MAX_BYTES } from "@/lib/release/upload-check";
import type { MeasurementComparison } from "@/lib/release/measurements";

export const stageSchema = z.enum(STAGE_ORDER);

const fileName = z.string().min(1, "Give the file's name.").max(400);

// ── views (JSON as the client receives it) ───────────────────────────────────
export interface BuildListItem {
  id: string;
  boardModel: string;
  version: string;
  revisionRange: string;
  stage: (typeof STAGE_ORDER)[number];
  authorName: string;
  bankBytes: number | null;
  updatedAt: string;
}

export interface UploadView {
  id: string;
  kind: string;
  originalName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  createdAt: string;
}

export interface BuildDetail {
  build: BuildListItem & {
    boardModelId: string;
    authorUserId: string;
    authorEmail: string;
    bankSha256: string | null;
    bankCrc32: number | null;
    /** Key id of the Ed25519 bank signature made at pilot; null while unsigned. */
    bankSignatureKeyId: string | null;
    releaseNotes: string | null;
    waiverReason: string | null;
    withdrawnReason: string | null;
    createdAt: string;
  };
  slots: { slotIndex: number; profileVersionId: string; profileName: string; coolerModel: string; version: string; boardRange: string; encodedBytes: number; contentHash: string }[];
  revisions: { revision: string; memoryBytes: number; slotCount: number; baseAddress: number }[];
  uploads: { firmware: UploadView | null; labReport: UploadView | null; measurements: UploadView | null };
  reviews: {
    id: string;
    reviewerUserId: string;
    reviewerName: string;
    verdict: "approve" | "request_changes";
    comment: string;
    resolvedAt: string | null;
    createdAt: string;
    updatedAt: string;
    /** Whether this review counts toward the approvals now and, if not, why. */
    standing: { counts: boolean; reason: string | null };
  }[];
  approvals: { counting: number; required: number; openChangeRequests: number };
  transitions: { id: string; fromStage: string; toStage: string; actorName: string; reason: string | null; createdAt: string }[];
  comparison: { state: "none" } | { state: "invalid"; errors: string[] } | { state: "ok"; coolerModel: string; toleranceDb: number; rows: MeasurementComparison[] };
}

export interface BuildOptions {
  boardModels: { id: string; name: string }[];
  revisions: { revision: string; memoryBytes: number; slotCount: number; maxPointsPerCurve: number }[];
  candidates: { id: string; profileName: string; coolerModel: string; version: string; boardRange: string; encodedBytes: number }[];
}

export interface MailboxMessage {
  id: number;
  fromAddress: string;
  toAddresses: string[];
  subject: string;
  body: string;
  receivedAt: string;
}

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
});

export const createBuildBody = z.strictObject({
  boardModelId: z.uuid("Pick a board model."),
  version: z.string().regex(/^(0|[1-9]\d{0,2})\.(0|[1-9]\d{0,2})\.(0|[1-9]\d{0,2})$/, "Give a version such as 1.4.0 (three numbers, each 0–255)."),
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
});

export const buildOptionsQuery = z.strictObject({ boardModelId: z.uuid().optional() });

export const getBuildOptions = defineOperation({
  id: "getBuildOptions",
  method: "GET",
  path: "/api/v1/builds/options",
  summary: "Board models, their revisions and the published profile versions a new build can use",
  tag: "Builds",
  access: "build:create",
  query: buildOptionsQuery,
});

export const getBuild = defineOperation({
  id: "getBuild",
  method: "GET",
  path: "/api/v1/builds/{id}",
  summary: "A build with slots, uploads, reviews, stage timeline and measured-against-estimated sound",
  tag: "Builds",
  access: "read",
  params: idParams,
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
});

export const resolveReview = defineOperation({
  id: "resolveReview",
  method: "POST",
  path: "/api/v1/builds/{id}/reviews/{reviewId}/resolve",
  summary: "The build's author marks a change request resolved",
  tag: "Builds",
  access: "build:create",
  params: z.strictObject({ id: z.uuid("Not a valid id."), reviewId: z.uuid("Not a valid id.") }),
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
});

export const downloadUpload = defineOperation({
  id: "downloadUpload",
  method: "GET",
  path: "/api/v1/uploads/{id}",
  summary: "Download an uploaded file; its SHA-256 is in the x-content-sha256 header",
  tag: "Builds",
  access: "read",
  params: idParams,
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
});
