import { apiRoute } from "@/lib/platform/http/api-route";
import { clearSignInThrottle } from "@/lib/api/operations/admin";
import { auditActor } from "@/lib/platform/auth/actor";
import { unlockAccount } from "@/lib/use-cases/admin/sign-in-throttle";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(clearSignInThrottle, async ({ actor, body, requestId }) => unlockAccount(auditActor(actor, requestId), body));
