import { apiRoute } from "@/lib/platform/http/api-route";
import { getShippedWithBuild } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { shippedReport } from "@/lib/use-cases/support/withdrawn";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(getShippedWithBuild, async ({ params }) => shippedReport(getDb(), { buildId: params.id }));
