import { apiRoute } from "@/lib/platform/http/api-route";
import { createLot as createLotOp, listLots as listLotsOp } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { createLot, listLots } from "@/db/lots";
import { auditActor } from "@/lib/platform/auth/actor";
import { toLotView } from "@/lib/use-cases/lots/lot-view";
import { lotsPage } from "@/lib/use-cases/lots/read";
import { AppError } from "@/lib/api/errors";

export const GET = apiRoute(listLotsOp, async ({ query }) => lotsPage(getDb(), query));

export const POST = apiRoute(createLotOp, async ({ actor, body, requestId }) => {
  const db = getDb();
  const lot = await createLot(db, auditActor(actor, requestId), body);
  const [row] = await listLots(db, { lotId: lot.id, sort: "serial", dir: "asc", limit: 1, offset: 0 });
  if (!row) throw new AppError("internal", "The lot was recorded but could not be read back.");
  return { lot: toLotView(row) };
});
