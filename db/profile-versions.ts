import "server-only";
import { asc, eq, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { components, coolerModels, profiles, profileVersions, users } from "./schema";
import type { Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";

/** The profile a version is published into, locked so publishes of one profile queue behind each other; with its owner's name. */
export async function lockProfileForPublish(tx: Executor, { profileId }: { profileId: string }) {
  const [profile] = await tx.select().from(profiles).where(eq(profiles.id, profileId)).for("update");
  if (!profile) return undefined;
  const [owner] = await tx.select({ name: users.name }).from(users).where(eq(users.id, profile.ownerUserId));
  return { profile, ownerName: owner?.name };
}

/** The version numbers already published in a profile. */
export async function listVersionNumbers(db: Executor, { profileId }: { profileId: string }): Promise<string[]> {
  return (await db.select({ version: profileVersions.version }).from(profileVersions).where(eq(profileVersions.profileId, profileId))).map((r) => r.version);
}

/**
 * Writes a published version, marks its profile changed, and records the audit event, all
 * with `tx`. The unique index (profile, version) is the last guard against a double publish;
 * its refusal reaches the caller as a storage failure of kind "unique".
 */
export async function insertPublishedVersion(
  tx: Executor,
  actor: AuditActor & { userId: string },
  input: {
    profileId: string;
    version: string;
    parts: readonly [number, number, number];
    boardRange: string;
    changelog: string;
    image: { document: unknown; encodedBytes: number; crc32: number; contentHash: string };
    /** Set when an administrator publishes into someone else's profile. */
    onBehalfOfOwnerUserId?: string;
  },
) {
  const [row] = await tx
    .insert(profileVersions)
    .values({
      profileId: input.profileId,
      version: input.version,
      versionMajor: input.parts[0],
      versionMinor: input.parts[1],
      versionPatch: input.parts[2],
      boardRange: input.boardRange,
      document: input.image.document,
      encodedBytes: input.image.encodedBytes,
      crc32: input.image.crc32,
      contentHash: input.image.contentHash,
      changelog: input.changelog,
      authorUserId: actor.userId,
    })
    .returning();
  if (!row) throw new Error("INSERT … RETURNING gave no row");
  await tx.update(profiles).set({ updatedAt: new Date() }).where(eq(profiles.id, input.profileId));
  const { document: _doc, ...summary } = row;
  const onBehalf = input.onBehalfOfOwnerUserId ? { onBehalfOfOwnerUserId: input.onBehalfOfOwnerUserId } : {};
  await recordAudit(tx, actor, { action: "profile_version.publish", entityType: "profile_version", entityId: row.id, after: { ...summary, ...onBehalf } });
  const [author] = await tx.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
  return { ...summary, authorName: author?.name ?? actor.label, createdAt: row.createdAt.toISOString() };
}

/**
 * Published versions matching `where`, each with its profile's name and the cooler model it
 * was published for with that model's fan and pump: what re-encoding a version or checking
 * it against hardware limits needs.
 */
export async function listVersionsWithHardware(db: Executor, where: SQL) {
  const fan = alias(components, "fan");
  const pump = alias(components, "pump");
  return db
    .select({ pv: profileVersions, profileName: profiles.name, cooler: coolerModels, fan, pump })
    .from(profileVersions)
    .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
    .innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId))
    .innerJoin(fan, eq(fan.id, coolerModels.fanComponentId))
    .innerJoin(pump, eq(pump.id, coolerModels.pumpComponentId))
    .where(where);
}

export async function getVersion(db: Executor, { id }: { id: string }) {
  const [row] = await db
    .select({ v: profileVersions, authorName: users.name, profileName: profiles.name })
    .from(profileVersions)
    .innerJoin(users, eq(users.id, profileVersions.authorUserId))
    .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
    .where(eq(profileVersions.id, id));
  if (!row) return undefined;
  const v = row.v;
  return {
    id: v.id,
    profileId: v.profileId,
    profileName: row.profileName,
    version: v.version,
    boardRange: v.boardRange,
    encodedBytes: v.encodedBytes,
    crc32: v.crc32,
    contentHash: v.contentHash,
    changelog: v.changelog,
    authorName: row.authorName,
    createdAt: v.createdAt.toISOString(),
    document: v.document,
  };
}

/** Every version of every profile for coolers on one board model, for the compatibility matrix. */
export async function listVersionsForBoardModel(db: Executor, { boardModelId }: { boardModelId: string }) {
  return db
    .select({
      versionId: profileVersions.id,
      profileId: profiles.id,
      profileName: profiles.name,
      coolerModelName: coolerModels.name,
      version: profileVersions.version,
      boardRange: profileVersions.boardRange,
      encodedBytes: profileVersions.encodedBytes,
      maxPointsPerCurve: sql<number>`greatest(jsonb_array_length(${profileVersions.document} #> '{pump,points}'), jsonb_array_length(${profileVersions.document} #> '{fans,points}'))`,
    })
    .from(profileVersions)
    .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
    .innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId))
    .where(eq(coolerModels.boardModelId, boardModelId))
    .orderBy(asc(coolerModels.name), asc(profiles.name), asc(profileVersions.versionMajor), asc(profileVersions.versionMinor), asc(profileVersions.versionPatch));
}
