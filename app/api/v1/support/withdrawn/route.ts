import { apiRoute } from "@/lib/platform/http/api-route";
import { listWithdrawnBuilds } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { withdrawnBuilds } from "@/lib/use-cases/support/withdrawn";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listWithdrawnBuilds, async () => withdrawnBuilds(getDb()));
