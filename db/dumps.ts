import "server-only";
import { desc, eq, inArray, sql } from "drizzle-orm";
import { boardModels, boardRevisions, builds, profileVersions } from "./schema";
import { listVersionsWithHardware } from "./profile-versions";
import type { Executor } from "./client";
import type { ProfileSettings, RegistryBuild, RegistryVersion } from "@/lib/engine";
import { toHardwareContext } from "@/lib/registry/hardware-context";

/**
 * Published profile versions whose content hash starts with one of `prefixes`
 * (16 hex digits, as a slot stores them), with the stored document and the
 * cooler they were published for, so a dump's slots can be re-encoded and
 * checked against that cooler's pump and fan limits.
 */
export async function listRegistryVersionsByHashPrefix(db: Executor, { prefixes }: { prefixes: readonly string[] }): Promise<RegistryVersion[]> {
  const wanted = [...new Set(prefixes.map((p) => p.toLowerCase()).filter((p) => /^[0-9a-f]{16}$/.test(p)))];
  if (wanted.length === 0) return [];
  const rows = await listVersionsWithHardware(db, inArray(sql`left(${profileVersions.contentHash}, 16)`, wanted));
  const boardIds = [...new Set(rows.map((r) => r.cooler.boardModelId))];
  // The board revision with the most room: a dump does not say which revision it came from,
  // so only limits every revision shares (pump and fan minimum duties) can make a fault.
  const revisions = boardIds.length === 0 ? [] : await db.select().from(boardRevisions).where(inArray(boardRevisions.boardModelId, boardIds)).orderBy(desc(boardRevisions.memoryBytes), desc(boardRevisions.maxPointsPerCurve));
  return rows.map((r) => {
    const revision = revisions.find((v) => v.boardModelId === r.cooler.boardModelId);
    return {
      profileVersionId: r.pv.id,
      version: r.pv.version,
      contentHash: r.pv.contentHash,
      document: r.pv.document as ProfileSettings,
      profileName: r.profileName,
      coolerName: r.cooler.name,
      ...(revision ? { hardware: toHardwareContext({ cooler: r.cooler, fan: r.fan, pump: r.pump, revision }) } : {}),
    };
  });
}

/** Builds whose kept bank image has this SHA-256 (lower-case hex). */
export async function listBuildsByBankSha256(db: Executor, { sha256 }: { sha256: string }): Promise<RegistryBuild[]> {
  const rows = await db
    .select({ buildId: builds.id, version: builds.version, stage: builds.stage, boardModelName: boardModels.name, bankSha256: builds.bankSha256, bankSignature: builds.bankSignature, bankSignatureKeyId: builds.bankSignatureKeyId })
    .from(builds)
    .innerJoin(boardModels, eq(boardModels.id, builds.boardModelId))
    .where(eq(builds.bankSha256, sha256.toLowerCase()));
  return rows.flatMap((r) => {
    if (!r.bankSha256) return [];
    const signature = r.bankSignature && r.bankSignatureKeyId ? { bankSignature: { keyId: r.bankSignatureKeyId, signature: new Uint8Array(r.bankSignature) } } : {};
    return [{ buildId: r.buildId, version: r.version, stage: r.stage, boardModelName: r.boardModelName, bankSha256: r.bankSha256, ...signature }];
  });
}
