import { apiRoute } from "@/lib/platform/http/api-route";
import { getShippedWithBuild } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { shippedWithBuild } from "@/db/lots";
import { formatSerial } from "@/lib/serials/serial";

export const GET = apiRoute(getShippedWithBuild, async ({ params }) => {
  const { build, lots, boards } = await shippedWithBuild(getDb(), { buildId: params.id });
  const { serialPrefix, ...buildView } = build;
  return {
    build: buildView,
    boards,
    lots: lots.map((l) => ({ ...l, serialFrom: formatSerial(serialPrefix, l.serialFrom), serialTo: formatSerial(serialPrefix, l.serialTo), boards: l.serialTo - l.serialFrom + 1 })),
  };
});
