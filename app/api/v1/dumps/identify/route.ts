import { apiRoute } from "@/lib/platform/http/api-route";
import { identifyDump } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { identifyUploadedDump } from "@/lib/use-cases/support/identify-dump";

export const POST = apiRoute(identifyDump, async ({ req }) => identifyUploadedDump(getDb(), req));
