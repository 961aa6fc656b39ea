import "server-only";
import { asc, count, eq } from "drizzle-orm";
import { boardModels, boardRevisions, productionLots, type BoardModel, type BoardRevision } from "./schema";
import type { Executor } from "./client";
import { returnedRow } from "./rows";
import { compareVersions } from "@/lib/engine";
import { revisionFieldsOf, type RevisionField } from "@/lib/registry/revision-fields";

export type BoardRevisionInput = Pick<BoardRevision, RevisionField>;

/** A revision as the API shows it: its ids and its own fields, without timestamps. */
export const revisionView = (r: BoardRevision) => ({ id: r.id, boardModelId: r.boardModelId, ...revisionFieldsOf(r) });

/** Revisions in semver order (text order would put 10.0.0 before 2.0.0). */
export function sortRevisions<T extends { revision: string }>(rows: T[]): T[] {
  return [...rows].sort((a, b) => compareVersions(a.revision, b.revision));
}

/** Every board model by name, each with its revisions in semver order: the one board-model list (registry, build and lot forms). */
export async function listBoardModels(db: Executor) {
  const models = await db.select().from(boardModels).orderBy(asc(boardModels.name));
  const revisions = await db.select().from(boardRevisions);
  return models.map((m) => boardModelView(m, revisions.filter((r) => r.boardModelId === m.id)));
}

export async function listRevisionsOfModel(db: Executor, { boardModelId }: { boardModelId: string }) {
  return sortRevisions(await db.select().from(boardRevisions).where(eq(boardRevisions.boardModelId, boardModelId)));
}

export async function getBoardRevision(db: Executor, { id }: { id: string }) {
  const [row] = await db
    .select({ revision: boardRevisions, boardModelName: boardModels.name })
    .from(boardRevisions)
    .innerJoin(boardModels, eq(boardModels.id, boardRevisions.boardModelId))
    .where(eq(boardRevisions.id, id));
  return row ? { revision: revisionView(row.revision), boardModelName: row.boardModelName } : undefined;
}

/** A board model, locked until the transaction ends (an update reads it, judges, then writes). */
export async function lockBoardModel(tx: Executor, { id }: { id: string }) {
  const [row] = await tx.select().from(boardModels).where(eq(boardModels.id, id)).for("update");
  return row;
}

/** A board revision's own row, locked until the transaction ends. */
export async function lockBoardRevision(tx: Executor, { id }: { id: string }) {
  const [row] = await tx.select().from(boardRevisions).where(eq(boardRevisions.id, id)).for("update");
  return row;
}

/** Whether the board model exists, share-locked so it cannot be removed before the caller's insert. */
export async function boardModelExists(tx: Executor, { id }: { id: string }): Promise<boolean> {
  const [row] = await tx.select({ id: boardModels.id }).from(boardModels).where(eq(boardModels.id, id)).for("share");
  return !!row;
}

/** How many production lots name this board model, or this board revision. */
export async function countLotsOf(db: Executor, by: { boardModelId: string } | { boardRevisionId: string }): Promise<number> {
  const where = "boardModelId" in by ? eq(productionLots.boardModelId, by.boardModelId) : eq(productionLots.boardRevisionId, by.boardRevisionId);
  const [row] = await db.select({ n: count() }).from(productionLots).where(where);
  return row?.n ?? 0;
}

export async function insertBoardModel(tx: Executor, input: { name: string; serialPrefix: string; description: string }) {
  return returnedRow(tx.insert(boardModels).values(input).returning());
}

export async function updateBoardModelRow(tx: Executor, { id, ...input }: { id: string; name: string; serialPrefix: string; description: string }) {
  return returnedRow(tx.update(boardModels).set({ ...input, updatedAt: new Date() }).where(eq(boardModels.id, id)).returning());
}

export async function insertBoardRevision(tx: Executor, input: BoardRevisionInput & { boardModelId: string }) {
  return returnedRow(tx.insert(boardRevisions).values(input).returning());
}

export async function updateBoardRevisionRow(tx: Executor, { id, ...input }: BoardRevisionInput & { id: string }) {
  return returnedRow(tx.update(boardRevisions).set({ ...input, updatedAt: new Date() }).where(eq(boardRevisions.id, id)).returning());
}

/** A board model with its revisions in semver order, as the API shows it. */
export function boardModelView(m: BoardModel, revisions: BoardRevision[]) {
  return { id: m.id, name: m.name, serialPrefix: m.serialPrefix, description: m.description, revisions: sortRevisions(revisions).map(revisionView) };
}
