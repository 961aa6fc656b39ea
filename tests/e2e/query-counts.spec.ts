import { randomUUID } from "node:crypto";
import { expect, test } from "@playwright/test";
import { ACCOUNTS, signInRequest } from "./support/accounts";
import { requestStatsFile, statsOf } from "./support/request-stats";

const statsFile = requestStatsFile(Number(process.env.E2E_PORT || 3100));

// Kept at these numbers: a change that resolves the session twice in one request, or adds
// statements to these requests, has to change this file too. Finding the caller costs at
// most one more statement (none while the actor cache holds the user).
// proxy.ts checks that PostgreSQL answers before any screen (select 1); the page itself shows
// the actor only and its lists load through the API.
const ACCOUNT_PAGE_QUERIES = 1;
const ME_API_QUERIES = 0;

test("a page request resolves the session once for layout and page, and costs the statements written here", async ({ request }) => {
  await signInRequest(request, ACCOUNTS.viewer);
  const requestId = `page-${randomUUID()}`;
  const res = await request.get("/account", { headers: { "x-request-id": requestId } });
  expect(res.status()).toBe(200);
  const stats = await statsOf(statsFile, requestId);
  expect(stats.sessionLookups).toBe(1);
  expect(stats.actorQueries).toBeLessThanOrEqual(1);
  expect(stats.queries - stats.actorQueries).toBe(ACCOUNT_PAGE_QUERIES);
});

test("an API request with a session resolves it once and costs the statements written here", async ({ request }) => {
  await signInRequest(request, ACCOUNTS.viewer);
  const requestId = `api-${randomUUID()}`;
  const res = await request.get("/api/v1/me", { headers: { "x-request-id": requestId } });
  expect(res.status()).toBe(200);
  const stats = await statsOf(statsFile, requestId);
  expect(stats.sessionLookups).toBe(1);
  expect(stats.actorQueries).toBeLessThanOrEqual(1);
  expect(stats.queries - stats.actorQueries).toBe(ME_API_QUERIES);
});
