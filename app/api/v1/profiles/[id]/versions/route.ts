import { apiRoute } from "@/lib/platform/http/api-route";
import { listVersions, publishVersion } from "@/lib/api/operations/profiles";
import { AppError } from "@/lib/api/errors";
import { getDb } from "@/db/client";
import { getProfileRow, listVersionsOfProfile } from "@/db/profiles";
import { publishProfileVersion } from "@/lib/use-cases/profiles/publish";
import { auditActor } from "@/lib/platform/auth/actor";

export const GET = apiRoute(listVersions, async ({ params }) => {
  const db = getDb();
  if (!(await getProfileRow(db, { id: params.id }))) throw new AppError("not_found", "No such profile.");
  return { items: await listVersionsOfProfile(db, { profileId: params.id }) };
});

export const POST = apiRoute(publishVersion, async ({ actor, params, body, requestId }) => ({
  version: await publishProfileVersion(getDb(), { ...auditActor(actor, requestId), userId: actor.userId, role: actor.role }, { profileId: params.id, ...body }),
}));
