import { apiRoute } from "@/lib/platform/http/api-route";
import { exportShippedCsv } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { shippedWithBuild } from "@/db/lots";
import { formatSerial } from "@/lib/serials/serial";
import { toCsv } from "@/lib/csv/write";
import { AppError } from "@/lib/api/errors";

export const GET = apiRoute(exportShippedCsv, async ({ params }) => {
  const { build, lots } = await shippedWithBuild(getDb(), { buildId: params.id });
  // The list of boards in the field is for recalls: it answers for withdrawn builds only.
  if (build.stage !== "withdrawn") throw new AppError("not_found", "No withdrawn build with this id; the shipped-boards list exists for withdrawn builds only.");
  const csv = toCsv([
    ["lot_code", "board_revision", "build_version", "serial_from", "serial_to", "boards", "produced_on", "line"],
    ...lots.map((l) => [l.lotCode, l.revision, build.version, formatSerial(build.serialPrefix, l.serialFrom), formatSerial(build.serialPrefix, l.serialTo), String(l.serialTo - l.serialFrom + 1), l.producedOn, l.line]),
  ]);
  const name = `shipped-${build.boardModelName.replace(/[^A-Za-z0-9]+/g, "-")}-${build.version}.csv`;
  return new Response(csv, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${name}"`, "cache-control": "no-store" } });
});
