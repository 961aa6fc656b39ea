import { apiRoute } from "@/lib/platform/http/api-route";
import { listMailbox } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { mailboxPage } from "@/lib/use-cases/admin/read";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listMailbox, async ({ query }) => mailboxPage(getDb(), query));
