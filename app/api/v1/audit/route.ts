import { apiRoute } from "@/lib/platform/http/api-route";
import { listAudit } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { auditPage } from "@/lib/use-cases/admin/read";

export const GET = apiRoute(listAudit, async ({ query }) => auditPage(getDb(), query));
