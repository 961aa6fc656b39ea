import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadBuildVectors } from "@/lib/api/operations/firmware";
import { getDb } from "@/db/client";
import { downloadResponse } from "@/lib/platform/http/download";
import { vectorsFile } from "@/lib/use-cases/builds/downloads";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(downloadBuildVectors, async ({ params }) => downloadResponse(await vectorsFile(getDb(), { id: params.id })));
