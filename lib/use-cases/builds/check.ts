import "server-only";
import type { Executor } from "@/db/client";
import { listRevisionsOfModel } from "@/db/boards";
import { listBuildSlots, loadSlotFacts } from "@/db/builds";
import { AppError } from "@/lib/api/errors";
import { checkBuild } from "@/lib/release/build-check";

/** The chosen versions in slot order; a slot naming no version, or one for a cooler on another board, is refused with its slot number. */
async function slotFacts(db: Executor, { ids, boardModelId }: { ids: string[]; boardModelId: string }) {
  const found = await loadSlotFacts(db, { ids });
  return ids.map((id, i) => {
    const r = found.get(id);
    if (!r) throw new AppError("validation_failed", `Slot ${i + 1}: profile version ${id} does not exist.`, { issues: [{ path: `/slots/${i}`, message: "Unknown profile version." }] });
    if (r.boardModelId !== boardModelId) {
      throw new AppError("validation_failed", `Slot ${i + 1} (${r.label}) is for ${r.cooler.name}, a cooler on another board model.`, { issues: [{ path: `/slots/${i}`, message: "Pick a profile version for a cooler on this board model." }] });
    }
    return r;
  });
}

/** The engine's verdict on a set of slots for a board model and revision range, from the registry's rows. */
export async function checkSlots(db: Executor, input: { boardModelId: string; revisionRange: string; profileVersionIds: string[] }) {
  const [revisions, slots] = await Promise.all([
    listRevisionsOfModel(db, { boardModelId: input.boardModelId }),
    slotFacts(db, { ids: input.profileVersionIds, boardModelId: input.boardModelId }),
  ]);
  return { check: checkBuild({ revisionRange: input.revisionRange, revisions, slots }), slots, revisions };
}

/** The same check for a stored build's slots. */
export async function checkStoredBuild(db: Executor, build: { id: string; boardModelId: string; revisionRange: string }) {
  const slots = await listBuildSlots(db, { buildId: build.id });
  return checkSlots(db, { boardModelId: build.boardModelId, revisionRange: build.revisionRange, profileVersionIds: slots.map((s) => s.profileVersionId) });
}
