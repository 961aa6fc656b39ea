import "server-only";
import type { listLots } from "@/db/lots";
import type { LotView } from "@/lib/api/operations/support";
import { formatSerial } from "@/lib/serials/serial";

type LotRow = Awaited<ReturnType<typeof listLots>>[number];

export function toLotView(r: LotRow): LotView {
  return {
    id: r.id,
    lotCode: r.lotCode,
    serialFrom: formatSerial(r.serialPrefix, r.serialFrom),
    serialTo: formatSerial(r.serialPrefix, r.serialTo),
    boards: r.serialTo - r.serialFrom + 1,
    producedOn: r.producedOn,
    line: r.line,
    boardModelName: r.boardModelName,
    revision: r.revision,
    buildId: r.buildId,
    buildVersion: r.buildVersion,
    buildStage: r.buildStage,
  };
}
