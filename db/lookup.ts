import "server-only";
import { and, desc, eq, lte, or, sql } from "drizzle-orm";
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

/**
 * The serial lookup's hot query, prepared once per database handle under a fixed
 * name so PostgreSQL plans it once per connection. The inner select walks the btree
 * (board_model_id, serial_from) backwards to the last lot starting at or below the
 * serial (LIMIT 1 keeps the planner from sorting); the caller checks serial_to.
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
    .innerJoin(builds, eq(builds.id, lot.buildId))
    .prepare("support_lot_by_serial");
}

const fan = alias(components, "fan");
const pump = alias(components, "pump");

function buildSlotsForLookup(db: Database) {
  return db
    .select({
      buildId: builds.id,
      buildVersion: builds.version,
      buildStage: builds.stage,
      revisionRange: builds.revisionRange,
      slotIndex: buildSlots.slotIndex,
      profileVersionId: profileVersions.id,
      version: profileVersions.version,
      document: profileVersions.document,
      profileId: profiles.id,
      profileName: profiles.name,
      cooler: {
        name: coolerModels.name,
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
        flowAtMaxRpmLpm: pump.flowAtMaxRpmLpm,
      },
    })
    .from(builds)
    .innerJoin(buildSlots, eq(buildSlots.buildId, builds.id))
    .innerJoin(profileVersions, eq(profileVersions.id, buildSlots.profileVersionId))
    .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
    .innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId))
    .innerJoin(fan, eq(fan.id, coolerModels.fanComponentId))
    .innerJoin(pump, eq(pump.id, coolerModels.pumpComponentId))
    // The shipped build, and every production build of the board model (newer ones are picked in code by semver).
    .where(or(eq(builds.id, sql.placeholder("buildId")), and(eq(builds.boardModelId, sql.placeholder("boardModelId")), eq(builds.stage, "production"))))
    .orderBy(builds.id, buildSlots.slotIndex)
    .prepare("support_lookup_slots");
}

const prepared = new WeakMap<Database, { lotBySerial: ReturnType<typeof buildLotBySerial>; slots: ReturnType<typeof buildSlotsForLookup> }>();

function statements(db: Database) {
  let s = prepared.get(db);
  if (!s) {
    s = { lotBySerial: buildLotBySerial(db), slots: buildSlotsForLookup(db) };
    prepared.set(db, s);
  }
  return s;
}

export type LotBySerial = NonNullable<Awaited<ReturnType<typeof findLotBySerial>>>;

/** The lot holding this serial of the board model with this prefix, with its revision and build; undefined when none does. */
export async function findLotBySerial(db: Database, { prefix, serialNumber }: { prefix: string; serialNumber: number }) {
  const [row] = await statements(db).lotBySerial.execute({ prefix, serial: serialNumber });
  if (!row || row.lot.serialTo < serialNumber) return undefined;
  return row;
}

export type LookupSlotRow = Awaited<ReturnType<typeof findLookupSlots>>[number];

/** Slots of the shipped build and of every production build of the board model, with the hardware to plot them on. */
export async function findLookupSlots(db: Database, { buildId, boardModelId }: { buildId: string; boardModelId: string }) {
  return statements(db).slots.execute({ buildId, boardModelId });
}

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
