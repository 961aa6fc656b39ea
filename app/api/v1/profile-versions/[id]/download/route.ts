import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadVersion } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { downloadResponse } from "@/lib/platform/http/download";
import { profileVersionFile } from "@/lib/use-cases/profiles/read";

export const GET = apiRoute(downloadVersion, async ({ params }) => downloadResponse(await profileVersionFile(getDb(), { id: params.id })));
