import "server-only";
import { sortRevisions } from "./boards";
import { and, asc, count, desc, eq, inArray, sql, sum, type SQL } from "drizzle-orm";
import { boardModels, boardRevisions, builds, buildTransitions, productionLots, users, type ProductionLot } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, recordAuditMany, type AuditActor } from "./audit";
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

/** Rows checked and written per statement: 1,000 lots × 7 columns stays far below PostgreSQL's 65,535 parameters. */
const IMPORT_BATCH = 1000;

/** How far an import has got, for a progress bar: rows checked against the database, then rows written. */
export interface ImportProgress {
  phase: "checking" | "writing";
  done: number;
  total: number;
}

/** Thrown between batches when the client has gone (cancelled); the transaction rolls back. */
export class ImportCancelled extends Error {
  constructor() {
    super("The import was cancelled; nothing was recorded.");
  }
}

/**
 * Checks parsed CSV rows against the database (board, revision, build stage and
 * range, existing lot codes and overlapping lots) and, unless this is a dry run,
 * inserts them all in ONE transaction with one audit event per lot. Any bad row
 * means nothing is written; the issues name row, column and problem.
 *
 * Built for files of 100,000 lots: the natural keys (prefix, revision, build version) are
 * looked up once per distinct combination, lot codes and overlaps are checked a batch at a
 * time, and lots and their audit events are inserted a batch per statement. `onProgress`
 * hears after each batch; an aborted `signal` stops between batches and rolls everything back.
 */
export async function importLots(
  db: Database,
  actor: AuditActor,
  { rows, dryRun, onProgress, signal }: { rows: { row: number; lot: LotInput }[]; dryRun: boolean; onProgress?: (p: ImportProgress) => void | Promise<void>; signal?: AbortSignal },
): Promise<{ issues: LotRowIssue[]; committed: number; checked: number }> {
  const stopIfCancelled = () => {
    if (signal?.aborted) throw new ImportCancelled();
  };
  try {
    const committed = await db.transaction(async (tx) => {
      const issues: LotRowIssue[] = [];
      const ready: { row: number; lot: ResolvedLot }[] = [];
      // One lookup per distinct (prefix, revision, build version); a factory file repeats a handful.
      const keyed = new Map<string, Promise<{ resolved?: ResolvedLot; issues: LotFieldIssue[] }>>();
      for (let at = 0; at < rows.length; at += IMPORT_BATCH) {
        stopIfCancelled();
        const batch: { row: number; lot: ResolvedLot }[] = [];
        for (const { row, lot } of rows.slice(at, at + IMPORT_BATCH)) {
          const prefix = parseSerial(lot.serialFrom);
          const key = `${prefix.ok ? prefix.serial.prefix : lot.serialFrom}\u0000${lot.boardRevision}\u0000${lot.buildVersion}`;
          let pending = keyed.get(key);
          if (!pending) {
            pending = resolveLot(tx, lot, { lockBuild: !dryRun });
            keyed.set(key, pending);
          }
          const { resolved, issues: found } = await pending;
          for (const i of found) issues.push({ row, column: COLUMN_OF[i.field], message: i.message });
          if (!resolved) continue;
          const from = parseSerial(lot.serialFrom);
          const to = parseSerial(lot.serialTo);
          if (!from.ok || !to.ok) continue;
          batch.push({ row, lot: { ...resolved, lotCode: lot.lotCode, serialFrom: from.serial.number, serialTo: to.serial.number, producedOn: lot.producedOn, line: lot.line } });
        }
        const taken = batch.length
          ? new Set((await tx.select({ code: productionLots.lotCode }).from(productionLots).where(inArray(productionLots.lotCode, batch.map((b) => b.lot.lotCode)))).map((r) => r.code))
          : new Set<string>();
        const overlaps = await findOverlappingLots(tx, batch.map((b) => b.lot));
        batch.forEach((b, i) => {
          const dup = taken.has(b.lot.lotCode);
          if (dup) issues.push({ row: b.row, column: "lot_code", message: `Lot ${b.lot.lotCode} is already recorded.` });
          const other = overlaps.get(i);
          if (other) issues.push({ row: b.row, column: "serial_from", message: overlapMessage(other) });
          if (!dup && !other) ready.push(b);
        });
        await onProgress?.({ phase: "checking", done: Math.min(at + IMPORT_BATCH, rows.length), total: rows.length });
      }
      if (issues.length || dryRun) throw new RollBack(issues);
      for (let at = 0; at < ready.length; at += IMPORT_BATCH) {
        stopIfCancelled();
        const inserted = await tx.insert(productionLots).values(ready.slice(at, at + IMPORT_BATCH).map((r) => r.lot)).returning();
        await recordAuditMany(tx, actor, inserted.map((lot) => ({ action: "lot.import", entityType: "production_lot", entityId: lot.id, after: lot })));
        await onProgress?.({ phase: "writing", done: Math.min(at + IMPORT_BATCH, ready.length), total: ready.length });
      }
      stopIfCancelled();
      return ready.length;
    });
    return { issues: [], committed, checked: rows.length };
  } catch (err) {
    if (err instanceof RollBack) return { issues: err.issues.sort((a, b) => a.row - b.row), committed: 0, checked: rows.length };
    if (isExclusionViolation(err)) throw new AppError("conflict", "Another lot overlapping these serials was recorded at the same moment; nothing was imported. Run the preview again.");
    throw err;
  }
}

/**
 * For each lot of a batch, an existing lot of its board model whose serials it shares (by the
 * lot's position in the batch), in one query over the exclusion constraint's GiST index.
 */
async function findOverlappingLots(tx: Executor, lots: ResolvedLot[]): Promise<Map<number, { lotCode: string; serialFrom: number; serialTo: number; prefix: string }>> {
  const found = new Map<number, { lotCode: string; serialFrom: number; serialTo: number; prefix: string }>();
  if (lots.length === 0) return found;
  // Arrays travel as one text parameter each; uuids and integers came from the database and the parser.
  const models = `{${lots.map((l) => l.boardModelId).join(",")}}`;
  const froms = `{${lots.map((l) => l.serialFrom).join(",")}}`;
  const tos = `{${lots.map((l) => l.serialTo).join(",")}}`;
  // Recorded lots never overlap each other, so the only candidate is the lot starting last at or
  // before the new lot's end: one backward walk of the (board_model_id, serial_from) btree per lot.
  const res = await tx.execute<{ i: string; lot_code: string; serial_from: string; serial_to: string; prefix: string }>(sql`
    select x.i, o.lot_code, o.serial_from, o.serial_to, m.serial_prefix as prefix
    from unnest(${models}::uuid[], ${froms}::bigint[], ${tos}::bigint[]) with ordinality as x(board_model_id, serial_from, serial_to, i)
    cross join lateral (
      select p.lot_code, p.serial_from, p.serial_to
      from ${productionLots} p
      where p.board_model_id = x.board_model_id and p.serial_from <= x.serial_to
      order by p.serial_from desc
      limit 1
    ) o
    join ${boardModels} m on m.id = x.board_model_id
    where o.serial_to >= x.serial_from`);
  for (const r of res.rows) found.set(Number(r.i) - 1, { lotCode: r.lot_code, serialFrom: Number(r.serial_from), serialTo: Number(r.serial_to), prefix: r.prefix });
  return found;
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
      withdrawnAt: buildTransitions.createdAt,
      withdrawnByName: users.name,
      lots: count(productionLots.id),
      boards: sql<string>`coalesce(${sum(sql`${productionLots.serialTo} - ${productionLots.serialFrom} + 1`)}, 0)`.mapWith(Number),
    })
    .from(builds)
    .innerJoin(boardModels, eq(boardModels.id, builds.boardModelId))
    // Withdrawn is the last stage, so a build has at most one move into it: who and when.
    .leftJoin(buildTransitions, and(eq(buildTransitions.buildId, builds.id), eq(buildTransitions.toStage, "withdrawn")))
    .leftJoin(users, eq(users.id, buildTransitions.actorUserId))
    .leftJoin(productionLots, eq(productionLots.buildId, builds.id))
    .where(eq(builds.stage, "withdrawn"))
    .groupBy(builds.id, boardModels.name, buildTransitions.id, users.id)
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
