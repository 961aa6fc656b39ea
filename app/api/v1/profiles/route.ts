import { apiRoute } from "@/lib/platform/http/api-route";
import { createProfile, listProfiles } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import * as profiles from "@/db/profiles";
import { auditActor } from "@/lib/platform/auth/actor";

export const GET = apiRoute(listProfiles, async ({ query }) => {
  const page = await profiles.listProfiles(getDb(), query);
  return { ...page, items: page.items.map((p) => ({ ...p, updatedAt: p.updatedAt.toISOString() })) };
});

export const POST = apiRoute(createProfile, async ({ actor, body, requestId }) => ({
  profile: await profiles.createProfile(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, body),
}));
