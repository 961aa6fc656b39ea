import "server-only";
import semver from "semver";
import type { Database } from "@/db/client";
import type { AuditActor } from "@/db/audit";
import { isConstraintFailure } from "@/db/errors";
import { getCoolerHardware } from "@/db/profiles";
import { insertPublishedVersion, listVersionNumbers, lockProfileForPublish } from "@/db/profile-versions";
import { AppError } from "@/lib/api/errors";
import type { Role } from "@/lib/auth/roles";
import { publishRefusal } from "@/lib/registry/ownership";
import { buildVersionImage } from "@/lib/registry/version-image";
import { latestVersion } from "@/lib/versioning/semver-helpers";
import { STORED_VERSION_HINT, storedVersionParts } from "@/lib/versioning/stored-version";

/**
 * Publishes an immutable profile version, in one transaction: the profile is locked so
 * publishes of one profile queue behind each other; only its owner or an administrator
 * publishes (403 otherwise); the number must be greater than every published one (409);
 * the document is validated and encoded for every board revision the range admits (422
 * with the issues otherwise); then the row and its audit event are written. Two publishes
 * of one number that raced past the ordering check meet the unique index: one wins, the
 * other is told to reload.
 */
export async function publishProfileVersion(
  db: Database,
  actor: AuditActor & { userId: string; role: Role },
  input: { profileId: string; version: string; changelog: string; boardRange: string; text: string },
) {
  const parts = storedVersionParts(input.version);
  if (!parts) throw new AppError("validation_failed", `Use a version the board can store: ${STORED_VERSION_HINT}.`, { issues: [{ path: "/version", message: `Use ${STORED_VERSION_HINT}.` }] });
  try {
    return await db.transaction(async (tx) => {
      const locked = await lockProfileForPublish(tx, { profileId: input.profileId });
      if (!locked) throw new AppError("not_found", "No such profile.");
      const { profile } = locked;
      const refusal = publishRefusal(actor, { ownerUserId: profile.ownerUserId, ownerName: locked.ownerName ?? "another user", name: profile.name });
      if (refusal) throw new AppError("forbidden", refusal);
      const highest = latestVersion(await listVersionNumbers(tx, { profileId: profile.id }));
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
      return insertPublishedVersion(tx, actor, {
        profileId: profile.id,
        version: input.version,
        parts,
        boardRange: input.boardRange,
        changelog: input.changelog,
        image: built.image,
        // An administrator publishing into someone else's profile leaves that intent on record.
        onBehalfOfOwnerUserId: profile.ownerUserId !== actor.userId ? profile.ownerUserId : undefined,
      });
    });
  } catch (err) {
    if (isConstraintFailure(err, "unique")) {
      throw new AppError("conflict", `Version ${input.version} of this profile was just published by someone else; reload and choose the next number.`);
    }
    throw err;
  }
}
