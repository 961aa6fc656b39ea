import { apiRoute } from "@/lib/platform/http/api-route";
import { getVersion } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { profileVersion } from "@/lib/use-cases/profiles/read";

export const GET = apiRoute(getVersion, async ({ params }) => profileVersion(getDb(), { id: params.id }));
