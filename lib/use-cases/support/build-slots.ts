import "server-only";
import type { Database } from "@/db/client";
import { listSlotsOfBuilds, type BuildSlotRow, type LookupBuild } from "@/db/lookup";
import type { LookupSlot } from "@/lib/api/operations/support";
import { ExpiringMemo } from "@/lib/cache/expiring-memo";
import type { CoolingProfile } from "@/lib/engine";

/**
 * How long this process reuses a build's slots as the lookup shows them. What a slot names —
 * the build's slots and the published profile versions — never changes once the build leaves
 * draft (database triggers; the app never moves a build back to draft). What may change is
 * the registry around it: a cooler model's or a component's figures. An edit made through
 * this process clears the memory at once (`forgetBuildSlots`); another instance shows it
 * within this many milliseconds. A build's stage and withdrawal are never kept here: the
 * lookup reads them with the lot on every request.
 */
export const BUILD_SLOTS_TTL_MS = 5_000;
const MAX_BUILDS = 2_000;

const globalForSlots = globalThis as unknown as { loopkeeperBuildSlots?: ExpiringMemo<LookupSlot[]> };

function memo(): ExpiringMemo<LookupSlot[]> {
  return (globalForSlots.loopkeeperBuildSlots ??= new ExpiringMemo<LookupSlot[]>({ ttlMs: BUILD_SLOTS_TTL_MS, maxEntries: MAX_BUILDS }));
}

/** A row with its hardware present; a slot whose cooler, fan or pump has gone is left out, as before. */
function toSlot(r: BuildSlotRow): LookupSlot | undefined {
  if (!r.cooler || !r.fan || !r.pump) return undefined;
  return {
    slotIndex: r.slotIndex,
    profileVersionId: r.profileVersionId,
    profileId: r.profileId,
    profileName: r.profileName,
    version: r.version,
    document: r.document as CoolingProfile,
    cooler: r.cooler,
    fan: r.fan,
    pump: r.pump,
  };
}

async function readSlots(db: Database, buildIds: string[]): Promise<Map<string, LookupSlot[]>> {
  const bySlots = new Map<string, LookupSlot[]>(buildIds.map((id) => [id, []]));
  for (const row of await listSlotsOfBuilds(db, { buildIds })) {
    const slot = toSlot(row);
    if (slot) bySlots.get(row.buildId)?.push(slot);
  }
  return bySlots;
}

/**
 * The slots of these builds, in slot order, by build id. Builds past draft come from this
 * process's memory when it has them (one query for all the missing ones otherwise); a draft
 * build's slots may still change, so they are always read.
 */
export async function slotsOfBuilds(db: Database, builds: Pick<LookupBuild, "id" | "stage">[]): Promise<Map<string, LookupSlot[]>> {
  const fixed = builds.filter((b) => b.stage !== "draft").map((b) => b.id);
  const drafts = builds.filter((b) => b.stage === "draft").map((b) => b.id);
  const out = await memo().getMany(fixed, (missing) => readSlots(db, missing));
  if (drafts.length) for (const [id, slots] of await readSlots(db, drafts)) out.set(id, slots);
  return out;
}

/** Forget every build's slots: called after a change to what a slot shows (cooler model, fan, pump) commits. */
export function forgetBuildSlots(): void {
  globalForSlots.loopkeeperBuildSlots?.clear();
}
