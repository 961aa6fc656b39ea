import { apiRoute } from "@/lib/platform/http/api-route";
import { exportShippedCsv } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { downloadResponse } from "@/lib/platform/http/download";
import { shippedCsv } from "@/lib/use-cases/support/withdrawn";

export const GET = apiRoute(exportShippedCsv, async ({ params }) => downloadResponse(await shippedCsv(getDb(), { buildId: params.id })));
