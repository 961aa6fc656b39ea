import { apiRoute } from "@/lib/platform/http/api-route";
import { listMailbox } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import * as mail from "@/db/mail";
import { messageBodyText } from "@/lib/mail/raw-message";

const PAGE_SIZE = 50;

export const GET = apiRoute(listMailbox, async ({ query }) => {
  const rows = await mail.listMailbox(getDb(), { limit: PAGE_SIZE + 1, offset: (query.page - 1) * PAGE_SIZE });
  return {
    items: rows.slice(0, PAGE_SIZE).map((r) => ({ id: r.id, fromAddress: r.fromAddress, toAddresses: r.toAddresses, subject: r.subject, body: messageBodyText(r.raw), receivedAt: r.receivedAt })),
    hasMore: rows.length > PAGE_SIZE,
  };
});
