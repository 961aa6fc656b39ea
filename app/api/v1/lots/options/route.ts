import { apiRoute } from "@/lib/platform/http/api-route";
import { getLotOptions } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { lotFormOptions } from "@/lib/use-cases/lots/read";

export const GET = apiRoute(getLotOptions, async () => lotFormOptions(getDb()));
