import { apiRoute } from "@/lib/platform/http/api-route";
import { getBuild } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { buildDetail } from "@/lib/use-cases/builds/detail";

export const GET = apiRoute(getBuild, async ({ params }) => buildDetail(getDb(), { id: params.id }));
