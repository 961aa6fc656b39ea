import { apiRoute } from "@/lib/platform/http/api-route";
import { createProfile, listProfiles } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import * as profiles from "@/db/profiles";
import { auditActor } from "@/lib/platform/auth/actor";
import { profilesPage } from "@/lib/use-cases/profiles/read";

export const GET = apiRoute(listProfiles, async ({ query }) => profilesPage(getDb(), query));

export const POST = apiRoute(createProfile, async ({ actor, body, requestId }) => ({
  profile: await profiles.createProfile(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, body),
}));
