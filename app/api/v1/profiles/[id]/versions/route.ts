import { apiRoute } from "@/lib/platform/http/api-route";
import { listVersions, publishVersion } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { publishProfileVersion } from "@/lib/use-cases/profiles/publish";
import { profileVersions } from "@/lib/use-cases/profiles/read";
import { auditActor } from "@/lib/platform/auth/actor";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listVersions, async ({ params }) => profileVersions(getDb(), { profileId: params.id }));

export const POST = apiRoute(publishVersion, async ({ actor, params, body, requestId }) => ({
  version: await publishProfileVersion(getDb(), { ...auditActor(actor, requestId), userId: actor.userId, role: actor.role }, { profileId: params.id, ...body }),
}));
