import "server-only";
import { asc, count, eq } from "drizzle-orm";
import { boardModels, boardRevisions, productionLots, type BoardRevision } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { AppError } from "@/lib/api/errors";
import { compareVersions } from "@/lib/engine";

export type BoardRevisionInput = Pick<
  BoardRevision,
  "revision" | "memoryBytes" | "baseAddress" | "slotCount" | "maxPointsPerCurve" | "pwmFrequencyHz" | "tachPulsesPerRev" | "notes"
>;

const revisionView = (r: BoardRevision) => ({
  id: r.id,
  boardModelId: r.boardModelId,
  revision: r.revision,
  memoryBytes: r.memoryBytes,
  baseAddress: r.baseAddress,
  slotCount: r.slotCount,
  maxPointsPerCurve: r.maxPointsPerCurve,
  pwmFrequencyHz: r.pwmFrequencyHz,
  tachPulsesPerRev: r.tachPulsesPerRev,
  notes: r.notes,
});

/** Revisions in semver order (text order would put 10.0.0 before 2.0.0). */
export function sortRevisions<T extends { revision: string }>(rows: T[]): T[] {
  return [...rows].sort((a, b) => compareVersions(a.revision, b.revision));
}

export async function listBoardModels(db: Executor) {
  const models = await db.select().from(boardModels).orderBy(asc(boardModels.name));
  const revisions = await db.select().from(boardRevisions);
  return models.map((m) => ({
    id: m.id,
    name: m.name,
    serialPrefix: m.serialPrefix,
    description: m.description,
    revisions: sortRevisions(revisions.filter((r) => r.boardModelId === m.id)).map(revisionView),
  }));
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

export async function createBoardModel(db: Database, actor: AuditActor, input: { name: string; serialPrefix: string; description: string }) {
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(boardModels).values(input).returning();
    if (!row) throw new AppError("internal", "The board model was not created.");
    await recordAudit(tx, actor, { action: "board_model.create", entityType: "board_model", entityId: row.id, after: row });
    return { id: row.id, name: row.name, serialPrefix: row.serialPrefix, description: row.description, revisions: [] };
  });
}

export async function createBoardRevision(db: Database, actor: AuditActor, { boardModelId, ...input }: BoardRevisionInput & { boardModelId: string }) {
  return db.transaction(async (tx) => {
    const [model] = await tx.select().from(boardModels).where(eq(boardModels.id, boardModelId));
    if (!model) throw new AppError("not_found", "No such board model.");
    const [row] = await tx.insert(boardRevisions).values({ ...input, boardModelId }).returning();
    if (!row) throw new AppError("internal", "The revision was not created.");
    await recordAudit(tx, actor, { action: "board_revision.create", entityType: "board_revision", entityId: row.id, after: row });
    return revisionView(row);
  });
}

export async function updateBoardModel(db: Database, actor: AuditActor, { id, ...input }: { id: string; name: string; serialPrefix: string; description: string }) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(boardModels).where(eq(boardModels.id, id)).for("update");
    if (!before) throw new AppError("not_found", "No such board model.");
    if (input.serialPrefix !== before.serialPrefix) {
      // Shipped serials carry the prefix; support looks boards up by it.
      const [lots] = await tx.select({ n: count() }).from(productionLots).where(eq(productionLots.boardModelId, id));
      if ((lots?.n ?? 0) > 0)
        throw new AppError("conflict", `Boards of this model have shipped in ${lots!.n} production lot(s); the serial prefix cannot change.`, {
          issues: [{ path: "/serialPrefix", message: "Keep the prefix once lots exist." }],
        });
    }
    const [row] = await tx.update(boardModels).set({ ...input, updatedAt: new Date() }).where(eq(boardModels.id, id)).returning();
    if (!row) throw new AppError("internal", "The board model was not updated.");
    await recordAudit(tx, actor, { action: "board_model.update", entityType: "board_model", entityId: id, before, after: row });
    const revisions = await listRevisionsOfModel(tx, { boardModelId: id });
    return { id: row.id, name: row.name, serialPrefix: row.serialPrefix, description: row.description, revisions: revisions.map(revisionView) };
  });
}

/** Fields that describe the flashed memory layout: fixed once boards of the revision have shipped. */
const LAYOUT_FIELDS = ["revision", "memoryBytes", "baseAddress", "slotCount", "maxPointsPerCurve", "pwmFrequencyHz", "tachPulsesPerRev"] as const;

export async function updateBoardRevision(db: Database, actor: AuditActor, { id, ...input }: BoardRevisionInput & { id: string }) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(boardRevisions).where(eq(boardRevisions.id, id)).for("update");
    if (!before) throw new AppError("not_found", "No such board revision.");
    const changed = LAYOUT_FIELDS.filter((k) => input[k] !== before[k]);
    if (changed.length > 0) {
      const [lots] = await tx.select({ n: count() }).from(productionLots).where(eq(productionLots.boardRevisionId, id));
      if ((lots?.n ?? 0) > 0)
        throw new AppError("conflict", `Boards of revision ${before.revision} have shipped in ${lots!.n} production lot(s); only the notes can change. Add a new revision instead.`, {
          issues: changed.map((k) => ({ path: `/${k}`, message: "Fixed once boards have shipped." })),
        });
    }
    const [row] = await tx.update(boardRevisions).set({ ...input, updatedAt: new Date() }).where(eq(boardRevisions.id, id)).returning();
    if (!row) throw new AppError("internal", "The revision was not updated.");
    await recordAudit(tx, actor, { action: "board_revision.update", entityType: "board_revision", entityId: id, before, after: row });
    return revisionView(row);
  });
}
