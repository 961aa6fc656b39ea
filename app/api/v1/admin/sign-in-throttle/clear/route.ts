import { apiRoute } from "@/lib/platform/http/api-route";
import { clearSignInThrottle } from "@/lib/api/operations/admin";
import { auditActor } from "@/lib/platform/auth/actor";
import { unlockAccount } from "@/lib/use-cases/admin/sign-in-throttle";

export const POST = apiRoute(clearSignInThrottle, async ({ actor, body, requestId }) => unlockAccount(auditActor(actor, requestId), body));
