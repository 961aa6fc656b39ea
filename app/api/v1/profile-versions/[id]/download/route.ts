import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadVersion } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { downloadResponse } from "@/lib/platform/http/download";
import { profileVersionFile } from "@/lib/use-cases/profiles/read";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(downloadVersion, async ({ params }) => downloadResponse(await profileVersionFile(getDb(), { id: params.id })));
