import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadBank } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { downloadResponse } from "@/lib/platform/http/download";
import { bankFile } from "@/lib/use-cases/builds/downloads";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(downloadBank, async ({ params, query }) => downloadResponse(await bankFile(getDb(), { id: params.id, format: query.format, revision: query.revision })));
