import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadBuildVectors } from "@/lib/api/operations/firmware";
import { getDb } from "@/db/client";
import { downloadResponse } from "@/lib/platform/http/download";
import { vectorsFile } from "@/lib/use-cases/builds/downloads";

export const GET = apiRoute(downloadBuildVectors, async ({ params }) => downloadResponse(await vectorsFile(getDb(), { id: params.id })));
