import { apiRoute } from "@/lib/platform/http/api-route";
import { listBoardSigningKeys } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { boardSigningKeys } from "@/lib/use-cases/registry/read";

export const GET = apiRoute(listBoardSigningKeys, async ({ params }) => boardSigningKeys(getDb(), { boardModelId: params.id }));
