import { apiRoute } from "@/lib/platform/http/api-route";
import { listWithdrawnBuilds } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { withdrawnBuilds } from "@/lib/use-cases/support/withdrawn";

export const GET = apiRoute(listWithdrawnBuilds, async () => withdrawnBuilds(getDb()));
