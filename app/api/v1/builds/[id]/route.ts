import { apiRoute } from "@/lib/server/api";
import { getBuild } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { buildDetail } from "@/lib/server/builds/detail";

export const GET = apiRoute(getBuild, async ({ params }) => buildDetail(getDb(), { id: params.id }));
