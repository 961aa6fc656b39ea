import "server-only";
import { and, desc, eq, inArray, lte, or, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import {
  boardRevisions,
  buildSlots,
  builds,
  components,
  coolerModels,
  productionLots,
  profileVersions,
  profiles,
  recentLookups,
  boardModels,
} from "./schema";
import type { Database, Executor } from "./client";

const fan = alias(components, "fan");
const pump = alias(components, "pump");

/**
 * The serial lookup's hot path in one round trip, prepared once per database handle under a
 * fixed name so PostgreSQL plans it once per connection. The inner select walks the btree
 * (board_model_id, serial_from) backwards to the last lot starting at or below the serial
 * (LIMIT 1 keeps the planner from sorting; the caller checks serial_to). Joined to it: the
 * board revision, and the builds that matter for the answer — the shipped one and the board
 * model's production builds (newer ones picked in code by semver) — with their stage as it
 * is now. Their slots are read apart by id (`listSlotsOfBuilds`): fixed once a build leaves
 * draft, so the caller may keep them.
 */
function buildLotBySerial(db: Database) {
  const lot = db
    .select({
      id: productionLots.id,
      lotCode: productionLots.lotCode,
      boardModelId: productionLots.boardModelId,
      boardRevisionId: productionLots.boardRevisionId,
      buildId: productionLots.buildId,
      serialFrom: productionLots.serialFrom,
      serialTo: productionLots.serialTo,
      producedOn: productionLots.producedOn,
      line: productionLots.line,
    })
    .from(productionLots)
    .where(
      and(
        sql`${productionLots.boardModelId} = (select ${boardModels.id} from ${boardModels} where ${boardModels.serialPrefix} = ${sql.placeholder("prefix")})`,
        lte(productionLots.serialFrom, sql.placeholder("serial")),
      ),
    )
    .orderBy(desc(productionLots.serialFrom))
    .limit(1)
    .as("lot");
  return db
    .select({
      lot: {
        id: lot.id,
        lotCode: lot.lotCode,
        serialFrom: lot.serialFrom,
        serialTo: lot.serialTo,
        producedOn: lot.producedOn,
        line: lot.line,
        boardModelId: lot.boardModelId,
        buildId: lot.buildId,
      },
      revision: {
        id: boardRevisions.id,
        revision: boardRevisions.revision,
        memoryBytes: boardRevisions.memoryBytes,
        baseAddress: boardRevisions.baseAddress,
        slotCount: boardRevisions.slotCount,
        maxPointsPerCurve: boardRevisions.maxPointsPerCurve,
        pwmFrequencyHz: boardRevisions.pwmFrequencyHz,
        tachPulsesPerRev: boardRevisions.tachPulsesPerRev,
      },
      build: {
        id: builds.id,
        version: builds.version,
        stage: builds.stage,
        revisionRange: builds.revisionRange,
        withdrawnReason: builds.withdrawnReason,
      },
    })
    .from(lot)
    .innerJoin(boardRevisions, eq(boardRevisions.id, lot.boardRevisionId))
    .innerJoin(builds, or(eq(builds.id, lot.buildId), and(eq(builds.boardModelId, lot.boardModelId), eq(builds.stage, "production"))))
    .prepare("support_lot_by_serial");
}

const prepared = new WeakMap<Database, ReturnType<typeof buildLotBySerial>>();

type LotRow = Awaited<ReturnType<ReturnType<typeof buildLotBySerial>["execute"]>>[number];
export type LookupBuild = LotRow["build"];
export interface LotBySerial {
  lot: LotRow["lot"];
  revision: LotRow["revision"];
  /** The shipped build and the board model's production builds, each once, with their stage now. */
  builds: LookupBuild[];
}

/**
 * The lot holding this serial of the board model with this prefix, its revision, and the
 * builds that matter for the answer. Undefined when no lot holds the serial.
 */
export async function findLotBySerial(db: Database, { prefix, serialNumber }: { prefix: string; serialNumber: number }): Promise<LotBySerial | undefined> {
  let statement = prepared.get(db);
  if (!statement) {
    statement = buildLotBySerial(db);
    prepared.set(db, statement);
  }
  const rows = await statement.execute({ prefix, serial: serialNumber });
  const first = rows[0];
  if (!first || first.lot.serialTo < serialNumber) return undefined;
  return { lot: first.lot, revision: first.revision, builds: rows.map((r) => r.build) };
}

/**
 * The slots of these builds with their published versions, profiles and hardware, one row
 * per slot, in slot order. A slot whose cooler, fan or pump is missing comes with those null.
 */
export async function listSlotsOfBuilds(db: Executor, { buildIds }: { buildIds: string[] }) {
  if (!buildIds.length) return [];
  return db
    .select({
      buildId: buildSlots.buildId,
      slotIndex: buildSlots.slotIndex,
      profileVersionId: profileVersions.id,
      version: profileVersions.version,
      document: profileVersions.document,
      profileId: profiles.id,
      profileName: profiles.name,
      cooler: {
        name: coolerModels.name,
        radiatorMm: coolerModels.radiatorMm,
        fanCount: coolerModels.fanCount,
        radiatorKPerWAtMinFan: coolerModels.radiatorKPerWAtMinFan,
        radiatorKPerWAtMaxFan: coolerModels.radiatorKPerWAtMaxFan,
      },
      fan: {
        name: fan.name,
        kind: fan.kind,
        minDutyPct: fan.minDutyPct,
        rpmAtMinDuty: fan.rpmAtMinDuty,
        maxRpm: fan.maxRpm,
        tachPulsesPerRev: fan.tachPulsesPerRev,
        refSoundDbA: fan.refSoundDbA,
        refRpm: fan.refRpm,
        soundExponent: fan.soundExponent,
        soundTable: fan.soundTable,
        stopsAtZeroDuty: fan.stopsAtZeroDuty,
        flowAtMaxRpmLpm: fan.flowAtMaxRpmLpm,
      },
      pump: {
        name: pump.name,
        kind: pump.kind,
        minDutyPct: pump.minDutyPct,
        rpmAtMinDuty: pump.rpmAtMinDuty,
        maxRpm: pump.maxRpm,
        tachPulsesPerRev: pump.tachPulsesPerRev,
        refSoundDbA: pump.refSoundDbA,
        refRpm: pump.refRpm,
        soundExponent: pump.soundExponent,
        soundTable: pump.soundTable,
        stopsAtZeroDuty: pump.stopsAtZeroDuty,
        flowAtMaxRpmLpm: pump.flowAtMaxRpmLpm,
      },
    })
    .from(buildSlots)
    .innerJoin(profileVersions, eq(profileVersions.id, buildSlots.profileVersionId))
    .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
    .leftJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId))
    .leftJoin(fan, eq(fan.id, coolerModels.fanComponentId))
    .leftJoin(pump, eq(pump.id, coolerModels.pumpComponentId))
    .where(inArray(buildSlots.buildId, buildIds))
    .orderBy(buildSlots.buildId, buildSlots.slotIndex);
}
export type BuildSlotRow = Awaited<ReturnType<typeof listSlotsOfBuilds>>[number];

export async function recordLookup(db: Executor, { userId, serial, found }: { userId: string; serial: string; found: boolean }): Promise<void> {
  await db.insert(recentLookups).values({ userId, serial, found });
}

/** The user's latest distinct lookups, newest first. */
export async function listRecentLookups(db: Executor, { userId, limit }: { userId: string; limit: number }) {
  const rows = await db
    .select({ serial: recentLookups.serial, found: recentLookups.found, createdAt: recentLookups.createdAt })
    .from(recentLookups)
    .where(eq(recentLookups.userId, userId))
    .orderBy(desc(recentLookups.createdAt), desc(recentLookups.id))
    .limit(limit * 4);
  const seen = new Set<string>();
  return rows.filter((r) => (seen.has(r.serial) ? false : (seen.add(r.serial), true))).slice(0, limit);
}

/** Every published profile version's identity, to match slots of a memory dump against. */
export async function listKnownProfileVersions(db: Executor) {
  return db
    .select({
      profileVersionId: profileVersions.id,
      contentHash: profileVersions.contentHash,
      version: profileVersions.version,
      profileName: profiles.name,
      coolerName: coolerModels.name,
    })
    .from(profileVersions)
    .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
    .innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId));
}
