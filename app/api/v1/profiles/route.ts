import { apiRoute } from "@/lib/platform/http/api-route";
import { createProfile as createProfileOp, listProfiles } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { createProfile } from "@/lib/use-cases/profiles/create";
import { profilesPage } from "@/lib/use-cases/profiles/read";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listProfiles, async ({ query }) => profilesPage(getDb(), query));

export const POST = apiRoute(createProfileOp, async ({ actor, body, requestId }) => ({
  profile: await createProfile(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, body),
}));
