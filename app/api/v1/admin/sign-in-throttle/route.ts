import { apiRoute } from "@/lib/platform/http/api-route";
import { listSignInThrottle } from "@/lib/api/operations/admin";
import { signInThrottleView } from "@/lib/use-cases/admin/sign-in-throttle";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listSignInThrottle, async () => signInThrottleView());
