import "server-only";
import { sortRevisions } from "./boards";
import { and, asc, count, desc, eq, inArray, sql, sum, type SQL } from "drizzle-orm";
import { boardModels, boardRevisions, builds, productionLots, type ProductionLot } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { AppError } from "@/lib/api/errors";
import { satisfiesRange } from "@/lib/versioning/semver-helpers";
import { formatSerial, parseSerial } from "@/lib/serials/serial";
import type { LotInput } from "@/lib/lots/input";

/** Stages whose builds the factory may flash, so a lot may name them. */
export const LOT_STAGES = ["pilot", "production"] as const;

export interface ResolvedLot {
  lotCode: string;
  boardModelId: string;
  boardRevisionId: string;
  buildId: string;
  serialFrom: number;
  serialTo: number;
  producedOn: string;
  line: string;
}

/** A problem with one field of a lot, for forms and CSV rows. */
export interface LotFieldIssue {
  field: keyof LotInput;
  message: string;
}

/**
 * Looks up the natural keys of a lot (serial prefix → board model, revision, build
 * version) and checks the rules the database cannot express simply: the build is at
 * pilot or production and its revision range includes the board revision. With
 * `lockBuild` the build row is share-locked until the transaction ends, so it cannot
 * be withdrawn between this check and the insert.
 */
export async function resolveLot(tx: Executor, lot: LotInput, { lockBuild }: { lockBuild: boolean }): Promise<{ resolved?: ResolvedLot; issues: LotFieldIssue[] }> {
  const from = parseSerial(lot.serialFrom);
  const to = parseSerial(lot.serialTo);
  if (!from.ok || !to.ok) return { issues: [{ field: "serialFrom", message: "Give both serials as PREFIX-NUMBER." }] };
  const [model] = await tx.select().from(boardModels).where(eq(boardModels.serialPrefix, from.serial.prefix)).limit(1);
  if (!model) return { issues: [{ field: "serialFrom", message: `No board model uses the serial prefix ${from.serial.prefix}.` }] };
  const issues: LotFieldIssue[] = [];
  const [revision] = await tx
    .select()
    .from(boardRevisions)
    .where(and(eq(boardRevisions.boardModelId, model.id), eq(boardRevisions.revision, lot.boardRevision)))
    .limit(1);
  if (!revision) issues.push({ field: "boardRevision", message: `${model.name} has no revision ${lot.boardRevision}.` });
  const buildQuery = tx
    .select({ id: builds.id, version: builds.version, stage: builds.stage, revisionRange: builds.revisionRange })
    .from(builds)
    .where(and(eq(builds.boardModelId, model.id), eq(builds.version, lot.buildVersion)))
    .limit(1);
  const [build] = lockBuild ? await buildQuery.for("share") : await buildQuery;
  if (!build) issues.push({ field: "buildVersion", message: `${model.name} has no build ${lot.buildVersion}.` });
  else if (!(LOT_STAGES as readonly string[]).includes(build.stage)) {
    issues.push({ field: "buildVersion", message: `Build ${build.version} is at stage "${build.stage}"; lots may only name builds at pilot or production.` });
  } else if (revision && !satisfiesRange(revision.revision, build.revisionRange)) {
    issues.push({ field: "boardRevision", message: `Build ${build.version} is for board revisions ${build.revisionRange}; revision ${revision.revision} is outside it.` });
  }
  if (issues.length || !revision || !build) return { issues };
  return {
    issues,
    resolved: {
      lotCode: lot.lotCode,
      boardModelId: model.id,
      boardRevisionId: revision.id,
      buildId: build.id,
      serialFrom: from.serial.number,
      serialTo: to.serial.number,
      producedOn: lot.producedOn,
      line: lot.line,
    },
  };
}

/** The lot whose serial range shares a serial with [from, to] on this board model, through the exclusion constraint's GiST index. */
export async function findOverlappingLot(db: Executor, { boardModelId, serialFrom, serialTo }: { boardModelId: string; serialFrom: number; serialTo: number }) {
  const [row] = await db
    .select({ id: productionLots.id, lotCode: productionLots.lotCode, serialFrom: productionLots.serialFrom, serialTo: productionLots.serialTo, prefix: boardModels.serialPrefix })
    .from(productionLots)
    .innerJoin(boardModels, eq(boardModels.id, productionLots.boardModelId))
    .where(
      and(
        eq(productionLots.boardModelId, boardModelId),
        sql`int8range(${productionLots.serialFrom}, ${productionLots.serialTo}, '[]') && int8range(${serialFrom}::bigint, ${serialTo}::bigint, '[]')`,
      ),
    )
    .limit(1);
  return row;
}

export function overlapMessage(lot: { lotCode: string; serialFrom: number; serialTo: number; prefix: string }): string {
  return `Those serials overlap lot ${lot.lotCode} (${formatSerial(lot.prefix, lot.serialFrom)} to ${formatSerial(lot.prefix, lot.serialTo)}). Serial ranges of one board model never overlap; check the range.`;
}

function isExclusionViolation(err: unknown): boolean {
  let e: unknown = err;
  for (let i = 0; i < 3 && e && typeof e === "object"; i++) {
    if ((e as { code?: unknown }).code === "23P01") return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

function issuesError(issues: LotFieldIssue[]): AppError {
  return new AppError("validation_failed", issues[0]?.message ?? "The lot is not valid.", { issues: issues.map((i) => ({ path: `/${i.field}`, message: i.message })) });
}

/** Records one production lot with its audit event; an overlapping range is refused by PostgreSQL and named here. */
export async function createLot(db: Database, actor: AuditActor, lot: LotInput): Promise<ProductionLot> {
  let attempted: ResolvedLot | undefined;
  try {
    return await db.transaction(async (tx) => {
      const { resolved, issues } = await resolveLot(tx, lot, { lockBuild: true });
      if (!resolved) throw issuesError(issues);
      attempted = resolved;
      const [row] = await tx.insert(productionLots).values(resolved).returning();
      if (!row) throw new AppError("internal", "The lot was not recorded.");
      await recordAudit(tx, actor, { action: "lot.create", entityType: "production_lot", entityId: row.id, after: row });
      return row;
    });
  } catch (err) {
    // The transaction is rolled back by now, so the lot in the way can be read.
    if (attempted && isExclusionViolation(err)) {
      const other = await findOverlappingLot(db, attempted);
      throw new AppError("conflict", other ? overlapMessage(other) : "Those serials overlap an existing lot of this board model.");
    }
    throw err;
  }
}

export interface LotRowIssue {
  row: number;
  column: string;
  message: string;
}

const COLUMN_OF: Record<keyof LotInput, string> = {
  lotCode: "lot_code",
  boardRevision: "board_revision",
  buildVersion: "build_version",
  serialFrom: "serial_from",
  serialTo: "serial_to",
  producedOn: "produced_on",
  line: "line",
};

/** Thrown inside the transaction to roll back a dry run or a file with bad rows. */
class RollBack extends Error {
  constructor(readonly issues: LotRowIssue[]) {
    super("roll back");
  }
}

/**
 * Checks parsed CSV rows against the database (board, revision, build stage and
 * range, existing lot codes and overlapping lots) and, unless this is a dry run,
 * inserts them all in ONE transaction with one audit event per lot. Any bad row
 * means nothing is written; the issues name row, column and problem.
 */
export async function importLots(
  db: Database,
  actor: AuditActor,
  { rows, dryRun }: { rows: { row: number; lot: LotInput }[]; dryRun: boolean },
): Promise<{ issues: LotRowIssue[]; committed: number; checked: number }> {
  try {
    const committed = await db.transaction(async (tx) => {
      const issues: LotRowIssue[] = [];
      const ready: { row: number; lot: ResolvedLot }[] = [];
      for (const { row, lot } of rows) {
        const { resolved, issues: found } = await resolveLot(tx, lot, { lockBuild: !dryRun });
        for (const i of found) issues.push({ row, column: COLUMN_OF[i.field], message: i.message });
        if (!resolved) continue;
        const [dup] = await tx.select({ id: productionLots.id }).from(productionLots).where(eq(productionLots.lotCode, resolved.lotCode)).limit(1);
        if (dup) issues.push({ row, column: "lot_code", message: `Lot ${resolved.lotCode} is already recorded.` });
        const other = await findOverlappingLot(tx, resolved);
        if (other) issues.push({ row, column: "serial_from", message: overlapMessage(other) });
        if (!dup && !other) ready.push({ row, lot: resolved });
      }
      if (issues.length || dryRun) throw new RollBack(issues);
      const inserted = await tx.insert(productionLots).values(ready.map((r) => r.lot)).returning();
      for (const lot of inserted) {
        await recordAudit(tx, actor, { action: "lot.import", entityType: "production_lot", entityId: lot.id, after: lot });
      }
      return inserted.length;
    });
    return { issues: [], committed, checked: rows.length };
  } catch (err) {
    if (err instanceof RollBack) return { issues: err.issues.sort((a, b) => a.row - b.row), committed: 0, checked: rows.length };
    if (isExclusionViolation(err)) throw new AppError("conflict", "Another lot overlapping these serials was recorded at the same moment; nothing was imported. Run the preview again.");
    throw err;
  }
}

export interface LotFilter {
  lotId?: string;
  boardModelId?: string;
  buildId?: string;
  lotCode?: string;
  sort: "serial" | "produced" | "code";
  dir: "asc" | "desc";
  limit: number;
  offset: number;
}

/** Lots with their board, revision and build, filtered and paged in the database. */
export async function listLots(db: Executor, f: LotFilter) {
  const where: SQL[] = [];
  if (f.lotId) where.push(eq(productionLots.id, f.lotId));
  if (f.boardModelId) where.push(eq(productionLots.boardModelId, f.boardModelId));
  if (f.buildId) where.push(eq(productionLots.buildId, f.buildId));
  if (f.lotCode) where.push(sql`${productionLots.lotCode} ilike ${`%${f.lotCode.replace(/[\\%_]/g, (c) => `\\${c}`)}%`}`);
  const column = f.sort === "produced" ? productionLots.producedOn : f.sort === "code" ? productionLots.lotCode : productionLots.serialFrom;
  return db
    .select({
      id: productionLots.id,
      lotCode: productionLots.lotCode,
      serialFrom: productionLots.serialFrom,
      serialTo: productionLots.serialTo,
      producedOn: productionLots.producedOn,
      line: productionLots.line,
      boardModelName: boardModels.name,
      serialPrefix: boardModels.serialPrefix,
      revision: boardRevisions.revision,
      buildId: builds.id,
      buildVersion: builds.version,
      buildStage: builds.stage,
    })
    .from(productionLots)
    .innerJoin(boardModels, eq(boardModels.id, productionLots.boardModelId))
    .innerJoin(boardRevisions, eq(boardRevisions.id, productionLots.boardRevisionId))
    .innerJoin(builds, eq(builds.id, productionLots.buildId))
    .where(where.length ? and(...where) : undefined)
    .orderBy(f.dir === "asc" ? asc(column) : desc(column), asc(productionLots.id))
    .limit(f.limit)
    .offset(f.offset);
}

/** Board models with their revisions and the builds a lot may name, for the lot form and filters. */
export async function lotOptions(db: Executor) {
  const models = await db.select({ id: boardModels.id, name: boardModels.name, serialPrefix: boardModels.serialPrefix }).from(boardModels).orderBy(asc(boardModels.name));
  // Semantic-version order (2.0.0 before 10.0.0), the same as every other revision list.
  const revisions = sortRevisions(await db.select({ boardModelId: boardRevisions.boardModelId, revision: boardRevisions.revision }).from(boardRevisions));
  const buildRows = await db
    .select({ id: builds.id, boardModelId: builds.boardModelId, version: builds.version, stage: builds.stage, revisionRange: builds.revisionRange })
    .from(builds)
    .where(inArray(builds.stage, ["pilot", "production", "withdrawn"]))
    .orderBy(desc(builds.createdAt));
  return models.map((m) => ({
    ...m,
    revisions: revisions.filter((r) => r.boardModelId === m.id).map((r) => r.revision),
    builds: buildRows.filter((b) => b.boardModelId === m.id).map(({ boardModelId: _m, ...b }) => b),
  }));
}

/** Withdrawn builds with how many boards shipped with each and in how many lots. */
export async function listWithdrawnBuilds(db: Executor) {
  return db
    .select({
      id: builds.id,
      version: builds.version,
      boardModelName: boardModels.name,
      withdrawnReason: builds.withdrawnReason,
      lots: count(productionLots.id),
      boards: sql<string>`coalesce(${sum(sql`${productionLots.serialTo} - ${productionLots.serialFrom} + 1`)}, 0)`.mapWith(Number),
    })
    .from(builds)
    .innerJoin(boardModels, eq(boardModels.id, builds.boardModelId))
    .leftJoin(productionLots, eq(productionLots.buildId, builds.id))
    .where(eq(builds.stage, "withdrawn"))
    .groupBy(builds.id, boardModels.name)
    .orderBy(desc(builds.updatedAt));
}

/** Every lot that shipped with a build, for the withdrawn-build report and its CSV export. */
export async function shippedWithBuild(db: Executor, { buildId }: { buildId: string }) {
  const [build] = await db
    .select({ id: builds.id, version: builds.version, stage: builds.stage, withdrawnReason: builds.withdrawnReason, boardModelName: boardModels.name, serialPrefix: boardModels.serialPrefix })
    .from(builds)
    .innerJoin(boardModels, eq(boardModels.id, builds.boardModelId))
    .where(eq(builds.id, buildId))
    .limit(1);
  if (!build) throw new AppError("not_found", "No such build.");
  const lots = await db
    .select({
      lotCode: productionLots.lotCode,
      revision: boardRevisions.revision,
      serialFrom: productionLots.serialFrom,
      serialTo: productionLots.serialTo,
      producedOn: productionLots.producedOn,
      line: productionLots.line,
    })
    .from(productionLots)
    .innerJoin(boardRevisions, eq(boardRevisions.id, productionLots.boardRevisionId))
    .where(eq(productionLots.buildId, buildId))
    .orderBy(asc(productionLots.serialFrom));
  const boards = lots.reduce((n, l) => n + (l.serialTo - l.serialFrom + 1), 0);
  return { build, lots, boards };
}
