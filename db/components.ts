import "server-only";
import { and, count, eq, ilike, inArray, type SQL } from "drizzle-orm";
import { components, type Component } from "./schema";
import type { Executor } from "./client";
import { returnedRow } from "./rows";
import { likeText, orderFor, pageWindow } from "./list-helpers";

export type ComponentInput = Pick<
  Component,
  "kind" | "name" | "minDutyPct" | "rpmAtMinDuty" | "maxRpm" | "tachPulsesPerRev" | "refSoundDbA" | "refRpm" | "soundExponent" | "flowAtMaxRpmLpm"
> &
  Partial<Pick<Component, "soundTable" | "stopsAtZeroDuty">>;

const SORT_COLUMNS = {
  name: components.name,
  kind: components.kind,
  maxRpm: components.maxRpm,
  minDutyPct: components.minDutyPct,
  refSoundDbA: components.refSoundDbA,
};

export async function listComponents(
  db: Executor,
  f: { q?: string; kind?: "fan" | "pump"; sort?: keyof typeof SORT_COLUMNS; dir: "asc" | "desc"; page: number; pageSize: number },
) {
  const where: SQL[] = [];
  if (f.q) where.push(ilike(components.name, likeText(f.q)));
  if (f.kind) where.push(eq(components.kind, f.kind));
  const cond = where.length ? and(...where) : undefined;
  const [items, [total]] = await Promise.all([
    db
      .select()
      .from(components)
      .where(cond)
      .orderBy(...orderFor(SORT_COLUMNS, f.sort, f.dir, "name", components.id))
      .limit(pageWindow(f).limit)
      .offset(pageWindow(f).offset),
    db.select({ n: count() }).from(components).where(cond),
  ]);
  return { items, total: total?.n ?? 0, page: f.page, pageSize: f.pageSize };
}

/** A component's row, locked until the transaction ends. */
export async function lockComponent(tx: Executor, { id }: { id: string }) {
  const [row] = await tx.select().from(components).where(eq(components.id, id)).for("update");
  return row;
}

/** The kinds of the components with these ids (fan or pump); ids no component has are absent. */
export async function componentKinds(db: Executor, { ids }: { ids: string[] }): Promise<Map<string, Component["kind"]>> {
  if (ids.length === 0) return new Map();
  const rows = await db.select({ id: components.id, kind: components.kind }).from(components).where(inArray(components.id, ids));
  return new Map(rows.map((r) => [r.id, r.kind]));
}

export async function insertComponent(tx: Executor, input: ComponentInput): Promise<Component> {
  return returnedRow(tx.insert(components).values(input).returning());
}

export async function updateComponentRow(tx: Executor, { id, ...input }: ComponentInput & { id: string }): Promise<Component> {
  return returnedRow(tx.update(components).set({ ...input, updatedAt: new Date() }).where(eq(components.id, id)).returning());
}
