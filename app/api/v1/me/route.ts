import { apiRoute } from "@/lib/platform/http/api-route";
import { getMe } from "@/lib/api/operations/account";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(getMe, async ({ actor }) => ({
  id: actor.userId,
  email: actor.email,
  name: actor.name,
  role: actor.role,
  via: actor.via,
}));
