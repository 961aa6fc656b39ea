import { apiRoute } from "@/lib/platform/http/api-route";
import { getMe } from "@/lib/api/operations/account";

export const GET = apiRoute(getMe, async ({ actor }) => ({
  id: actor.userId,
  email: actor.email,
  name: actor.name,
  role: actor.role,
  via: actor.via,
}));
