import { apiRoute } from "@/lib/platform/http/api-route";
import { createBuild as createBuildOp, listBuilds } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { createBuild } from "@/lib/use-cases/builds/create";
import { listBuildsForPipeline } from "@/lib/use-cases/builds/list";

export const GET = apiRoute(listBuilds, async ({ query }) => listBuildsForPipeline(getDb(), query));

export const POST = apiRoute(createBuildOp, async ({ actor, body, requestId }) => createBuild(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, body));
