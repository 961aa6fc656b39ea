import { apiRoute } from "@/lib/platform/http/api-route";
import { getBuildGate } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { buildGate } from "@/lib/use-cases/builds/gate";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(getBuildGate, async ({ actor, params }) => buildGate(getDb(), { id: params.id }, { userId: actor.userId, role: actor.role }));
