import { apiRoute } from "@/lib/platform/http/api-route";
import { changePassword as changePasswordOp } from "@/lib/api/operations/account";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { clientAddress } from "@/lib/platform/http/client-address";
import { changePassword } from "@/lib/use-cases/account/password";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(changePasswordOp, async ({ actor, body, req, requestId }) => changePassword(getDb(), actor, auditActor(actor, requestId), { ...body, client: clientAddress(req.headers) }));
