import { apiRoute } from "@/lib/platform/http/api-route";
import { lookupSerial } from "@/lib/api/operations/support";
import { getDb, getReadDb } from "@/db/client";
import { lookupSerialText } from "@/lib/use-cases/support/lookup";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(lookupSerial, async ({ actor, query }) => lookupSerialText({ read: getReadDb(), write: getDb() }, actor, query.serial));
