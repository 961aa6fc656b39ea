import { apiRoute } from "@/lib/platform/http/api-route";
import { getShippedWithBuild } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { shippedReport } from "@/lib/use-cases/support/withdrawn";

export const GET = apiRoute(getShippedWithBuild, async ({ params }) => shippedReport(getDb(), { buildId: params.id }));
