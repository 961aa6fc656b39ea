import "server-only";
import { and, asc, count, desc, eq, inArray, sql, sum, type SQL } from "drizzle-orm";
import { boardModels, boardRevisions, builds, buildTransitions, productionLots, users, type BuildStage, type ProductionLot } from "./schema";
import type { Executor } from "./client";
import type { LotKeys, ResolvedLot } from "@/lib/lots/rules";

/**
 * What a lot's natural keys name: the board model of the serial prefix, and that model's
 * revision and build with the given numbers (each absent when there is none). With
 * `lockBuild` the build row is share-locked until the transaction ends, so it cannot be
 * withdrawn between the caller's check and its insert.
 */
export async function findLotKeys(
  tx: Executor,
  { serialPrefix, revision, buildVersion, lockBuild }: { serialPrefix: string; revision: string; buildVersion: string; lockBuild: boolean },
): Promise<LotKeys> {
  const [model] = await tx.select({ id: boardModels.id, name: boardModels.name }).from(boardModels).where(eq(boardModels.serialPrefix, serialPrefix)).limit(1);
  if (!model) return {};
  const [found] = await tx
    .select({ id: boardRevisions.id, revision: boardRevisions.revision })
    .from(boardRevisions)
    .where(and(eq(boardRevisions.boardModelId, model.id), eq(boardRevisions.revision, revision)))
    .limit(1);
  const buildQuery = tx
    .select({ id: builds.id, version: builds.version, stage: builds.stage, revisionRange: builds.revisionRange })
    .from(builds)
    .where(and(eq(builds.boardModelId, model.id), eq(builds.version, buildVersion)))
    .limit(1);
  const [build] = lockBuild ? await buildQuery.for("share") : await buildQuery;
  return { model, revision: found, build };
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

/** Writes one lot; an overlapping range is refused by the exclusion constraint (a storage failure of kind "exclusion"). */
export async function insertLot(tx: Executor, lot: ResolvedLot): Promise<ProductionLot> {
  const [row] = await tx.insert(productionLots).values(lot).returning();
  if (!row) throw new Error("INSERT … RETURNING gave no row");
  return row;
}

/** Writes a batch of lots in one statement. */
export async function insertLots(tx: Executor, lots: ResolvedLot[]): Promise<ProductionLot[]> {
  return lots.length ? tx.insert(productionLots).values(lots).returning() : [];
}

/** Which of these lot codes are already recorded. */
export async function lotCodesTaken(db: Executor, { codes }: { codes: string[] }): Promise<Set<string>> {
  if (codes.length === 0) return new Set();
  return new Set((await db.select({ code: productionLots.lotCode }).from(productionLots).where(inArray(productionLots.lotCode, codes))).map((r) => r.code));
}

/**
 * For each lot of a batch, an existing lot of its board model whose serials it shares (by the
 * lot's position in the batch), in one query over the exclusion constraint's GiST index.
 */
export async function findOverlappingLots(tx: Executor, lots: ResolvedLot[]): Promise<Map<number, { lotCode: string; serialFrom: number; serialTo: number; prefix: string }>> {
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

/** Builds at these stages, newest first, with their board model: what the lot forms and filters offer. */
export async function listBuildsAtStages(db: Executor, { stages }: { stages: readonly BuildStage[] }) {
  return db
    .select({ id: builds.id, boardModelId: builds.boardModelId, version: builds.version, stage: builds.stage, revisionRange: builds.revisionRange })
    .from(builds)
    .where(inArray(builds.stage, [...stages]))
    .orderBy(desc(builds.createdAt));
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

/** Every lot that shipped with a build, for the withdrawn-build report and its CSV export; undefined when there is no such build. */
export async function shippedWithBuild(db: Executor, { buildId }: { buildId: string }) {
  const [build] = await db
    .select({ id: builds.id, version: builds.version, stage: builds.stage, withdrawnReason: builds.withdrawnReason, boardModelName: boardModels.name, serialPrefix: boardModels.serialPrefix })
    .from(builds)
    .innerJoin(boardModels, eq(boardModels.id, builds.boardModelId))
    .where(eq(builds.id, buildId))
    .limit(1);
  if (!build) return undefined;
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
