import { apiRoute } from "@/lib/platform/http/api-route";
import { getBuildOptions } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { buildFormOptions } from "@/lib/use-cases/builds/options";

export const GET = apiRoute(getBuildOptions, async ({ query }) => buildFormOptions(getDb(), query));
