import { apiRoute } from "@/lib/platform/http/api-route";
import { getBuild } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { buildDetail } from "@/lib/use-cases/builds/detail";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(getBuild, async ({ params }) => buildDetail(getDb(), { id: params.id }));
