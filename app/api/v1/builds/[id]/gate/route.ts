import { apiRoute } from "@/lib/platform/http/api-route";
import { getBuildGate } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { buildGate } from "@/lib/use-cases/builds/gate";

export const GET = apiRoute(getBuildGate, async ({ actor, params }) => buildGate(getDb(), { id: params.id }, { userId: actor.userId, role: actor.role }));
