import "server-only";
import { asc, desc, eq, inArray } from "drizzle-orm";
import { boardModels, buildReviews, builds, buildSlots, buildTransitions, coolerModels, profiles, profileVersions, users, type BuildStage } from "./schema";
import type { Executor } from "./client";
import { listVersionsWithHardware } from "./profile-versions";
import type { BuildSlotFacts } from "@/lib/release/build-check";

/** Build columns without the image bytes: what lists and pages need. */
const buildSummary = {
  id: builds.id,
  boardModelId: builds.boardModelId,
  boardModel: boardModels.name,
  version: builds.version,
  revisionRange: builds.revisionRange,
  stage: builds.stage,
  authorUserId: builds.authorUserId,
  authorName: users.name,
  authorEmail: users.email,
  firmwareUploadId: builds.firmwareUploadId,
  labReportUploadId: builds.labReportUploadId,
  measurementsUploadId: builds.measurementsUploadId,
  bankBytes: builds.bankBytes,
  bankSha256: builds.bankSha256,
  bankCrc32: builds.bankCrc32,
  bankSignatureKeyId: builds.bankSignatureKeyId,
  releaseNotes: builds.releaseNotes,
  waiverReason: builds.waiverReason,
  withdrawnReason: builds.withdrawnReason,
  createdAt: builds.createdAt,
  updatedAt: builds.updatedAt,
};

export type BuildSummary = NonNullable<Awaited<ReturnType<typeof getBuild>>>;

export async function listBuilds(db: Executor, { stage, limit }: { stage?: BuildStage; limit: number }) {
  return db
    .select(buildSummary)
    .from(builds)
    .innerJoin(boardModels, eq(boardModels.id, builds.boardModelId))
    .innerJoin(users, eq(users.id, builds.authorUserId))
    .where(stage ? eq(builds.stage, stage) : undefined)
    .orderBy(desc(builds.updatedAt))
    .limit(limit);
}

export async function getBuild(db: Executor, { id }: { id: string }) {
  const [row] = await db
    .select(buildSummary)
    .from(builds)
    .innerJoin(boardModels, eq(boardModels.id, builds.boardModelId))
    .innerJoin(users, eq(users.id, builds.authorUserId))
    .where(eq(builds.id, id))
    .limit(1);
  return row;
}

/** The build's own row (without joins), as gates judge it. */
export async function getBuildRow(db: Executor, { id }: { id: string }) {
  const [row] = await db.select().from(builds).where(eq(builds.id, id)).limit(1);
  return row;
}

export async function getBuildImage(db: Executor, { id }: { id: string }) {
  const [row] = await db.select({ bankImage: builds.bankImage, bankSignature: builds.bankSignature, bankSignatureKeyId: builds.bankSignatureKeyId, version: builds.version, boardModelId: builds.boardModelId, revisionRange: builds.revisionRange }).from(builds).where(eq(builds.id, id)).limit(1);
  return row;
}

export async function listBuildSlots(db: Executor, { buildId }: { buildId: string }) {
  return db
    .select({
      slotIndex: buildSlots.slotIndex,
      profileVersionId: profileVersions.id,
      version: profileVersions.version,
      boardRange: profileVersions.boardRange,
      encodedBytes: profileVersions.encodedBytes,
      contentHash: profileVersions.contentHash,
      authorUserId: profileVersions.authorUserId,
      profileId: profiles.id,
      profileName: profiles.name,
      coolerModelId: coolerModels.id,
      coolerModel: coolerModels.name,
    })
    .from(buildSlots)
    .innerJoin(profileVersions, eq(profileVersions.id, buildSlots.profileVersionId))
    .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
    .innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId))
    .where(eq(buildSlots.buildId, buildId))
    .orderBy(asc(buildSlots.slotIndex));
}

/** Published profile versions written for cooler models on this board model, newest first. */
export async function listSlotCandidates(db: Executor, { boardModelId }: { boardModelId: string }) {
  return db
    .select({
      id: profileVersions.id,
      version: profileVersions.version,
      boardRange: profileVersions.boardRange,
      encodedBytes: profileVersions.encodedBytes,
      profileName: profiles.name,
      coolerModel: coolerModels.name,
      createdAt: profileVersions.createdAt,
    })
    .from(profileVersions)
    .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
    .innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId))
    .where(eq(coolerModels.boardModelId, boardModelId))
    .orderBy(asc(coolerModels.name), asc(profiles.name), desc(profileVersions.versionMajor), desc(profileVersions.versionMinor), desc(profileVersions.versionPatch));
}

/**
 * Profile versions with everything the engine needs to check them in a build: the document,
 * version, board range and hash, and the cooler model's fan and pump (with its board model).
 * Ids no version has are left out; the caller says which slot that was.
 */
export async function loadSlotFacts(db: Executor, { ids }: { ids: string[] }): Promise<Map<string, BuildSlotFacts & { id: string; authorUserId: string; coolerModelId: string; boardModelId: string; profileName: string }>> {
  if (ids.length === 0) return new Map();
  const rows = await listVersionsWithHardware(db, inArray(profileVersions.id, ids));
  return new Map(rows.map((r) => [r.pv.id, {
      id: r.pv.id,
      boardModelId: r.cooler.boardModelId,
      profileName: r.profileName,
      authorUserId: r.pv.authorUserId,
      coolerModelId: r.cooler.id,
      label: `${r.profileName} ${r.pv.version}`,
      document: r.pv.document,
      version: r.pv.version,
      boardRange: r.pv.boardRange,
      contentHash: r.pv.contentHash,
      cooler: r.cooler,
      fan: r.fan,
      pump: r.pump,
    }]));
}

export async function listReviews(db: Executor, { buildId }: { buildId: string }) {
  return db
    .select({
      id: buildReviews.id,
      reviewerUserId: buildReviews.reviewerUserId,
      reviewerName: users.name,
      reviewerEmail: users.email,
      // The reviewer's account as it is now: the gate counts only active reviewers who still may review.
      reviewerRole: users.role,
      reviewerDisabledAt: users.disabledAt,
      verdict: buildReviews.verdict,
      comment: buildReviews.comment,
      resolvedAt: buildReviews.resolvedAt,
      createdAt: buildReviews.createdAt,
      updatedAt: buildReviews.updatedAt,
    })
    .from(buildReviews)
    .innerJoin(users, eq(users.id, buildReviews.reviewerUserId))
    .where(eq(buildReviews.buildId, buildId))
    .orderBy(asc(buildReviews.createdAt));
}

export async function listTransitions(db: Executor, { buildId }: { buildId: string }) {
  return db
    .select({ id: buildTransitions.id, fromStage: buildTransitions.fromStage, toStage: buildTransitions.toStage, actorName: users.name, reason: buildTransitions.reason, createdAt: buildTransitions.createdAt })
    .from(buildTransitions)
    .innerJoin(users, eq(users.id, buildTransitions.actorUserId))
    .where(eq(buildTransitions.buildId, buildId))
    .orderBy(asc(buildTransitions.createdAt));
}

export interface NewBuildInput {
  boardModelId: string;
  version: string;
  revisionRange: string;
  authorUserId: string;
  firmwareUploadId: string;
  profileVersionIds: string[];
  bank: { image: Uint8Array; bankBytes: number; sha256: string; crc32: number };
}

/** Writes a draft build with its slots (in slot order) and bank image; call inside the transaction that audits it. */
export async function insertBuild(tx: Executor, input: NewBuildInput) {
  const [row] = await tx
    .insert(builds)
    .values({
      boardModelId: input.boardModelId,
      version: input.version,
      revisionRange: input.revisionRange,
      authorUserId: input.authorUserId,
      firmwareUploadId: input.firmwareUploadId,
      bankImage: input.bank.image,
      bankBytes: input.bank.bankBytes,
      bankSha256: input.bank.sha256,
      bankCrc32: input.bank.crc32,
    })
    .returning({ id: builds.id, version: builds.version, stage: builds.stage });
  if (!row) throw new Error("INSERT … RETURNING gave no row");
  await tx.insert(buildSlots).values(input.profileVersionIds.map((profileVersionId, slotIndex) => ({ buildId: row.id, slotIndex, profileVersionId })));
  return row;
}
