import { apiRoute } from "@/lib/platform/http/api-route";
import { getBuildOptions } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { buildFormOptions } from "@/lib/use-cases/builds/options";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(getBuildOptions, async ({ query }) => buildFormOptions(getDb(), query));
