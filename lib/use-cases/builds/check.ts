import "server-only";
import type { Executor } from "@/db/client";
import { listRevisionsOfModel } from "@/db/boards";
import { listBuildSlots, loadSlotFacts } from "@/db/builds";
import { checkBuild } from "@/lib/release/build-check";

/** The engine's verdict on a set of slots for a board model and revision range, from the registry's rows. */
export async function checkSlots(db: Executor, input: { boardModelId: string; revisionRange: string; profileVersionIds: string[] }) {
  const [revisions, slots] = await Promise.all([
    listRevisionsOfModel(db, { boardModelId: input.boardModelId }),
    loadSlotFacts(db, { ids: input.profileVersionIds, boardModelId: input.boardModelId }),
  ]);
  return { check: checkBuild({ revisionRange: input.revisionRange, revisions, slots }), slots, revisions };
}

/** The same check for a stored build's slots. */
export async function checkStoredBuild(db: Executor, build: { id: string; boardModelId: string; revisionRange: string }) {
  const slots = await listBuildSlots(db, { buildId: build.id });
  return checkSlots(db, { boardModelId: build.boardModelId, revisionRange: build.revisionRange, profileVersionIds: slots.map((s) => s.profileVersionId) });
}
