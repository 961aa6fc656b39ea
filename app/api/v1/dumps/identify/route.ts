import { apiRoute } from "@/lib/platform/http/api-route";
import { identifyDump } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { identifyUploadedDump } from "@/lib/use-cases/support/identify-dump";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(identifyDump, async ({ req }) => identifyUploadedDump(getDb(), req));
