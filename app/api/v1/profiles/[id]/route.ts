import { apiRoute } from "@/lib/platform/http/api-route";
import { getProfile } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { profileDetail } from "@/lib/use-cases/profiles/read";

export const GET = apiRoute(getProfile, async ({ params }) => profileDetail(getDb(), { id: params.id }));
