import { apiRoute } from "@/lib/platform/http/api-route";
import { listAudit } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { auditPage } from "@/lib/use-cases/admin/read";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listAudit, async ({ query }) => auditPage(getDb(), query));
