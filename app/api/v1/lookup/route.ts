import { apiRoute } from "@/lib/platform/http/api-route";
import { lookupSerial } from "@/lib/api/operations/support";
import { getDb, getReadDb } from "@/db/client";
import { lookupSerialText } from "@/lib/use-cases/support/lookup";

export const GET = apiRoute(lookupSerial, async ({ actor, query }) => lookupSerialText({ read: getReadDb(), write: getDb() }, actor, query.serial));
