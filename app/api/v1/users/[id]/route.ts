import { apiRoute } from "@/lib/platform/http/api-route";
import { updateUser as updateUserOp } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { updateUser } from "@/lib/use-cases/admin/users";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const PATCH = apiRoute(updateUserOp, async ({ actor, params, body, requestId }) => ({ user: await updateUser(getDb(), auditActor(actor, requestId), { id: params.id, ...body }) }));
