import { apiRoute } from "@/lib/platform/http/api-route";
import { getProfile } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { profileDetail } from "@/lib/use-cases/profiles/read";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(getProfile, async ({ params }) => profileDetail(getDb(), { id: params.id }));
