import "server-only";
import type { Executor } from "@/db/client";
import { getUpload } from "@/db/uploads";
import { compareMeasurements, parseMeasurementsCsv, type MeasurementComparison } from "@/lib/release/measurements";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import { env } from "@/lib/platform/env";
import { getStorage } from "@/lib/platform/storage";
import { checkStoredBuild } from "@/lib/use-cases/builds/check";

export type ComparisonResult =
  | { state: "none" }
  | { state: "invalid"; errors: string[] }
  | { state: "ok"; coolerModel: string; toleranceDb: number; rows: MeasurementComparison[] };

/**
 * The lab's measured sound levels against the engine's estimate at the same pump and fan
 * speeds, for the cooler model of the build's first slot.
 */
export async function measurementComparison(db: Executor, build: { id: string; boardModelId: string; revisionRange: string; measurementsUploadId: string | null }): Promise<ComparisonResult> {
  if (!build.measurementsUploadId) return { state: "none" };
  const upload = await getUpload(db, { id: build.measurementsUploadId });
  if (!upload) return { state: "none" };
  const parsed = parseMeasurementsCsv((await getStorage().get(upload.storageKey)).toString("utf8"));
  if (!parsed.ok) return { state: "invalid", errors: parsed.errors };
  const { slots, revisions } = await checkStoredBuild(db, build);
  const first = slots[0];
  const revision = revisions[0];
  if (!first || !revision) return { state: "invalid", errors: ["The build has no slots or its board model no revisions to estimate against."] };
  const hw = toHardwareContext({ cooler: first.cooler, fan: first.fan, pump: first.pump, revision });
  const toleranceDb = env().SOUND_TOLERANCE_DB;
  return { state: "ok", coolerModel: first.cooler.name, toleranceDb, rows: compareMeasurements(parsed.rows, hw, toleranceDb) };
}
