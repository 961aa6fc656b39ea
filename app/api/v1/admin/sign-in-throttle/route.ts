import { apiRoute } from "@/lib/platform/http/api-route";
import { listSignInThrottle } from "@/lib/api/operations/admin";
import { signInThrottleView } from "@/lib/use-cases/admin/sign-in-throttle";

export const GET = apiRoute(listSignInThrottle, async () => signInThrottleView());
