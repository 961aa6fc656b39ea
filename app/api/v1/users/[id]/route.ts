import { apiRoute } from "@/lib/platform/http/api-route";
import { updateUser } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import * as users from "@/db/users";
import { auditActor } from "@/lib/platform/auth/actor";

export const PATCH = apiRoute(updateUser, async ({ actor, params, body, requestId }) => ({
  user: await users.updateUser(getDb(), auditActor(actor, requestId), { id: params.id, ...body }),
}));
