import { apiRoute } from "@/lib/platform/http/api-route";
import { getLotOptions } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { lotFormOptions } from "@/lib/use-cases/lots/read";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(getLotOptions, async () => lotFormOptions(getDb()));
