import "server-only";
import { asc, eq, sql } from "drizzle-orm";
import semver from "semver";
import { coolerModels, profiles, profileVersions, users } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { getCoolerHardware } from "./profiles";
import { AppError } from "@/lib/api/errors";
import { buildVersionImage } from "@/lib/registry/version-image";
import { publishRefusal } from "@/lib/registry/ownership";
import type { Role } from "@/lib/auth/roles";

/**
 * Publishes an immutable profile version. In one transaction: the profile row is
 * locked so publishes of one profile queue behind each other, the new number must
 * be greater than every existing one (409 otherwise), the document is validated
 * and encoded with the engine (422 with the issues otherwise), the row and its
 * audit event are written. The unique index (profile, version) is the last guard.
 */
export async function publishVersion(
  db: Database,
  actor: AuditActor & { userId: string; role: Role },
  input: { profileId: string; version: string; changelog: string; boardRange: string; text: string },
) {
  const parsed = semver.parse(input.version);
  if (!parsed || parsed.prerelease.length > 0) throw new AppError("validation_failed", "Use a version such as 1.2.0.", { issues: [{ path: "/version", message: "Use x.y.z." }] });
  try {
    return await db.transaction(async (tx) => {
      const [profile] = await tx.select().from(profiles).where(eq(profiles.id, input.profileId)).for("update");
      if (!profile) throw new AppError("not_found", "No such profile.");
      const [owner] = await tx.select({ name: users.name }).from(users).where(eq(users.id, profile.ownerUserId));
      const refusal = publishRefusal(actor, { ownerUserId: profile.ownerUserId, ownerName: owner?.name ?? "another user", name: profile.name });
      if (refusal) throw new AppError("forbidden", refusal);
      const existing = await tx.select({ version: profileVersions.version }).from(profileVersions).where(eq(profileVersions.profileId, profile.id));
      const highest = existing.map((e) => e.version).sort(semver.rcompare)[0];
      if (highest && !semver.gt(input.version, highest)) {
        throw new AppError("conflict", `Version ${input.version} is not greater than ${highest}, the latest published version; choose a higher number.`);
      }
      const hw = await getCoolerHardware(tx, { coolerModelId: profile.coolerModelId });
      if (!hw) throw new AppError("not_found", "The profile's cooler model is missing.");
      const built = buildVersionImage({ text: input.text, version: input.version, boardRange: input.boardRange, cooler: hw.cooler, fan: hw.fan, pump: hw.pump, revisions: hw.revisions });
      if (!built.ok) {
        throw new AppError("validation_failed", built.message, {
          issues: built.issues.length ? built.issues.map((i) => ({ path: i.path, message: i.message })) : [{ path: "/boardRange", message: built.message }],
        });
      }
      const img = built.image;
      const [row] = await tx
        .insert(profileVersions)
        .values({
          profileId: profile.id,
          version: input.version,
          versionMajor: parsed.major,
          versionMinor: parsed.minor,
          versionPatch: parsed.patch,
          boardRange: input.boardRange,
          document: img.document,
          encodedBytes: img.encodedBytes,
          crc32: img.crc32,
          contentHash: img.contentHash,
          changelog: input.changelog,
          authorUserId: actor.userId,
        })
        .returning();
      if (!row) throw new AppError("internal", "The version was not created.");
      await tx.update(profiles).set({ updatedAt: new Date() }).where(eq(profiles.id, profile.id));
      const { document: _doc, ...summary } = row;
      // An administrator publishing into someone else's profile leaves that intent on record.
      const onBehalf = profile.ownerUserId !== actor.userId ? { onBehalfOfOwnerUserId: profile.ownerUserId } : {};
      await recordAudit(tx, actor, { action: "profile_version.publish", entityType: "profile_version", entityId: row.id, after: { ...summary, ...onBehalf } });
      const [author] = await tx.select({ name: users.name }).from(users).where(eq(users.id, actor.userId));
      return { ...summary, authorName: author?.name ?? actor.label, createdAt: row.createdAt.toISOString() };
    });
  } catch (err) {
    // Two publishes that passed the ordering check at the same moment: the unique index lets one win.
    const cause = err as { code?: string; cause?: { code?: string } };
    if (cause.code === "23505" || cause.cause?.code === "23505") {
      throw new AppError("conflict", `Version ${input.version} of this profile was just published by someone else; reload and choose the next number.`);
    }
    throw err;
  }
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
