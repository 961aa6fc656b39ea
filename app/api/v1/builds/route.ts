import { apiRoute } from "@/lib/platform/http/api-route";
import { createBuild as createBuildOp, listBuilds } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { createBuild } from "@/lib/use-cases/builds/create";
import { listBuildsForPipeline } from "@/lib/use-cases/builds/list";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listBuilds, async ({ query }) => listBuildsForPipeline(getDb(), query));

export const POST = apiRoute(createBuildOp, async ({ actor, body, requestId }) => createBuild(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, body));
