import "server-only";
import type { Executor } from "@/db/client";
import { listWithdrawnBuilds, shippedWithBuild } from "@/db/lots";
import { AppError } from "@/lib/api/errors";
import { toCsv } from "@/lib/csv/write";
import { formatSerial } from "@/lib/serials/serial";
import type { DownloadFile } from "@/lib/platform/http/download";

/** Withdrawn builds with how many boards shipped with each and in how many lots. */
export async function withdrawnBuilds(db: Executor) {
  return { items: await listWithdrawnBuilds(db) };
}

async function shipped(db: Executor, { buildId }: { buildId: string }) {
  const found = await shippedWithBuild(db, { buildId });
  if (!found) throw new AppError("not_found", "No such build.");
  return found;
}

/** The lots that shipped with a build, serials written out, with the number of boards in each and in all. */
export async function shippedReport(db: Executor, { buildId }: { buildId: string }) {
  const { build, lots, boards } = await shipped(db, { buildId });
  const { serialPrefix, ...buildView } = build;
  return {
    build: buildView,
    boards,
    lots: lots.map((l) => ({ ...l, serialFrom: formatSerial(serialPrefix, l.serialFrom), serialTo: formatSerial(serialPrefix, l.serialTo), boards: l.serialTo - l.serialFrom + 1 })),
  };
}

/**
 * The boards in the field of a withdrawn build as CSV, for a recall. It answers for withdrawn
 * builds only (404 otherwise); cells that could start a spreadsheet formula are neutralised.
 */
export async function shippedCsv(db: Executor, { buildId }: { buildId: string }): Promise<DownloadFile> {
  const { build, lots } = await shipped(db, { buildId });
  if (build.stage !== "withdrawn") throw new AppError("not_found", "No withdrawn build with this id; the shipped-boards list exists for withdrawn builds only.");
  const csv = toCsv([
    ["lot_code", "board_revision", "build_version", "serial_from", "serial_to", "boards", "produced_on", "line"],
    ...lots.map((l) => [l.lotCode, l.revision, build.version, formatSerial(build.serialPrefix, l.serialFrom), formatSerial(build.serialPrefix, l.serialTo), String(l.serialTo - l.serialFrom + 1), l.producedOn, l.line]),
  ]);
  // A list of people's boards: not kept by caches on the way.
  return { bytes: csv, contentType: "text/csv; charset=utf-8", fileName: `shipped-${build.boardModelName.replace(/[^A-Za-z0-9]+/g, "-")}-${build.version}.csv`, cacheControl: "no-store" };
}
