import { apiRoute } from "@/lib/platform/http/api-route";
import { listMailbox } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { mailboxPage } from "@/lib/use-cases/admin/read";

export const GET = apiRoute(listMailbox, async ({ query }) => mailboxPage(getDb(), query));
