import "server-only";
import { alias } from "drizzle-orm/pg-core";
import { count, eq, ilike, sql } from "drizzle-orm";
import { boardModels, components, coolerModels, profiles, type CoolerModel } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { likeText, orderFor, pageWindow } from "./list-helpers";
import { AppError } from "@/lib/api/errors";

export type CoolerModelInput = Pick<
  CoolerModel,
  "name" | "radiatorMm" | "fanComponentId" | "fanCount" | "pumpComponentId" | "boardModelId" | "radiatorKPerWAtMinFan" | "radiatorKPerWAtMaxFan"
>;

const fan = alias(components, "fan");
const pump = alias(components, "pump");

const SORT_COLUMNS = { name: coolerModels.name, radiatorMm: coolerModels.radiatorMm, fanCount: coolerModels.fanCount };

function coolerSelect(db: Executor) {
  return db
    .select({
      id: coolerModels.id,
      name: coolerModels.name,
      radiatorMm: coolerModels.radiatorMm,
      fanComponentId: coolerModels.fanComponentId,
      fanName: fan.name,
      fanCount: coolerModels.fanCount,
      pumpComponentId: coolerModels.pumpComponentId,
      pumpName: pump.name,
      boardModelId: coolerModels.boardModelId,
      boardModelName: boardModels.name,
      radiatorKPerWAtMinFan: coolerModels.radiatorKPerWAtMinFan,
      radiatorKPerWAtMaxFan: coolerModels.radiatorKPerWAtMaxFan,
      profileCount: sql<number>`(select count(*)::int from ${profiles} where ${profiles.coolerModelId} = ${coolerModels.id})`,
    })
    .from(coolerModels)
    .innerJoin(fan, eq(fan.id, coolerModels.fanComponentId))
    .innerJoin(pump, eq(pump.id, coolerModels.pumpComponentId))
    .innerJoin(boardModels, eq(boardModels.id, coolerModels.boardModelId));
}

export async function listCoolerModels(db: Executor, f: { q?: string; sort?: keyof typeof SORT_COLUMNS; dir: "asc" | "desc"; page: number; pageSize: number }) {
  const cond = f.q ? ilike(coolerModels.name, likeText(f.q)) : undefined;
  const [items, [total]] = await Promise.all([
    coolerSelect(db)
      .where(cond)
      .orderBy(...orderFor(SORT_COLUMNS, f.sort, f.dir, "name", coolerModels.id))
      .limit(pageWindow(f).limit)
      .offset(pageWindow(f).offset),
    db.select({ n: count() }).from(coolerModels).where(cond),
  ]);
  return { items, total: total?.n ?? 0, page: f.page, pageSize: f.pageSize };
}

/** The fan and pump references must name a fan and a pump; a foreign key alone cannot say which kind. */
async function checkParts(tx: Executor, input: Pick<CoolerModelInput, "fanComponentId" | "pumpComponentId">) {
  const [f] = await tx.select().from(components).where(eq(components.id, input.fanComponentId));
  const [p] = await tx.select().from(components).where(eq(components.id, input.pumpComponentId));
  if (!f || f.kind !== "fan") throw new AppError("validation_failed", "Pick a fan component.", { issues: [{ path: "/fanComponentId", message: "Pick a fan." }] });
  if (!p || p.kind !== "pump") throw new AppError("validation_failed", "Pick a pump component.", { issues: [{ path: "/pumpComponentId", message: "Pick a pump." }] });
}

export async function createCoolerModel(db: Database, actor: AuditActor, input: CoolerModelInput) {
  return db.transaction(async (tx) => {
    await checkParts(tx, input);
    const [row] = await tx.insert(coolerModels).values(input).returning();
    if (!row) throw new AppError("internal", "The cooler model was not created.");
    await recordAudit(tx, actor, { action: "cooler_model.create", entityType: "cooler_model", entityId: row.id, after: row });
    const [view] = await coolerSelect(tx).where(eq(coolerModels.id, row.id));
    return view!;
  });
}

export async function updateCoolerModel(db: Database, actor: AuditActor, { id, ...input }: CoolerModelInput & { id: string }) {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(coolerModels).where(eq(coolerModels.id, id)).for("update");
    if (!before) throw new AppError("not_found", "No such cooler model.");
    await checkParts(tx, input);
    if (input.boardModelId !== before.boardModelId) {
      // Profiles are versioned against board ranges of this cooler's board; moving it would orphan them.
      const [used] = await tx.select({ n: count() }).from(profiles).where(eq(profiles.coolerModelId, id));
      if ((used?.n ?? 0) > 0)
        throw new AppError("conflict", `This cooler model has ${used!.n} profile(s) written for its board; its board model cannot change.`, {
          issues: [{ path: "/boardModelId", message: "Keep the board model while profiles exist." }],
        });
    }
    const [row] = await tx.update(coolerModels).set({ ...input, updatedAt: new Date() }).where(eq(coolerModels.id, id)).returning();
    if (!row) throw new AppError("internal", "The cooler model was not updated.");
    await recordAudit(tx, actor, { action: "cooler_model.update", entityType: "cooler_model", entityId: id, before, after: row });
    const [view] = await coolerSelect(tx).where(eq(coolerModels.id, id));
    return view!;
  });
}
