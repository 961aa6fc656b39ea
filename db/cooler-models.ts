import "server-only";
import { alias } from "drizzle-orm/pg-core";
import { count, eq, ilike, sql } from "drizzle-orm";
import { boardModels, components, coolerModels, profiles, type CoolerModel } from "./schema";
import type { Executor } from "./client";
import { returnedRow } from "./rows";
import { likeText, orderFor, pageWindow } from "./list-helpers";

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

/** The cooler model as lists show it: with its parts' and board model's names and how many profiles it has. */
export async function getCoolerModelView(db: Executor, { id }: { id: string }) {
  const [view] = await coolerSelect(db).where(eq(coolerModels.id, id));
  return view;
}

/** A cooler model's own row, locked until the transaction ends. */
export async function lockCoolerModel(tx: Executor, { id }: { id: string }) {
  const [row] = await tx.select().from(coolerModels).where(eq(coolerModels.id, id)).for("update");
  return row;
}

/** How many profiles are written for this cooler model. */
export async function countProfilesOf(db: Executor, { coolerModelId }: { coolerModelId: string }): Promise<number> {
  const [row] = await db.select({ n: count() }).from(profiles).where(eq(profiles.coolerModelId, coolerModelId));
  return row?.n ?? 0;
}

export async function insertCoolerModel(tx: Executor, input: CoolerModelInput) {
  return returnedRow(tx.insert(coolerModels).values(input).returning());
}

export async function updateCoolerModelRow(tx: Executor, { id, ...input }: CoolerModelInput & { id: string }) {
  return returnedRow(tx.update(coolerModels).set({ ...input, updatedAt: new Date() }).where(eq(coolerModels.id, id)).returning());
}
