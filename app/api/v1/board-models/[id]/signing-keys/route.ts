import { apiRoute } from "@/lib/platform/http/api-route";
import { listBoardSigningKeys } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { boardSigningKeys } from "@/lib/use-cases/registry/read";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listBoardSigningKeys, async ({ params }) => boardSigningKeys(getDb(), { boardModelId: params.id }));
