import "server-only";
import { and, count, eq, ilike, type SQL } from "drizzle-orm";
import { components, type Component } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { likeText, orderFor, pageWindow } from "./list-helpers";
import { AppError } from "@/lib/api/errors";

export type ComponentInput = Pick<
  Component,
  "kind" | "name" | "minDutyPct" | "rpmAtMinDuty" | "maxRpm" | "tachPulsesPerRev" | "refSoundDbA" | "refRpm" | "soundExponent" | "flowAtMaxRpmLpm"
>;

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

export async function createComponent(db: Database, actor: AuditActor, input: ComponentInput): Promise<Component> {
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(components).values(input).returning();
    if (!row) throw new AppError("internal", "The component was not created.");
    await recordAudit(tx, actor, { action: "component.create", entityType: "component", entityId: row.id, after: row });
    return row;
  });
}

export async function updateComponent(db: Database, actor: AuditActor, { id, ...input }: ComponentInput & { id: string }): Promise<Component> {
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(components).where(eq(components.id, id)).for("update");
    if (!before) throw new AppError("not_found", "No such component.");
    const [row] = await tx.update(components).set({ ...input, updatedAt: new Date() }).where(eq(components.id, id)).returning();
    if (!row) throw new AppError("internal", "The component was not updated.");
    await recordAudit(tx, actor, { action: "component.update", entityType: "component", entityId: id, before, after: row });
    return row;
  });
}
