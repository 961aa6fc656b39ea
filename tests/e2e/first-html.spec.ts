import { expect, test, type Browser, type BrowserContext } from "@playwright/test";
import { ACCOUNTS, signInRequest } from "./support/accounts";
import { BuildsPipeline } from "./pages/builds";
import { ProfilesList } from "./pages/profiles";

/*
 * Lists render their rows on the server: the first HTML response already holds them, before
 * any script runs. The browser here has JavaScript switched off, so nothing could have
 * fetched the rows after load; React's streamed markup stays where the server put it
 * (attached, but in the hidden part of the stream), so elements are found by attribute
 * and text, not by visibility.
 */

async function noScriptContext(browser: Browser): Promise<BrowserContext> {
  const context = await browser.newContext({ javaScriptEnabled: false });
  // The request API shares the context's cookies: signing in here gives the pages a session.
  await signInRequest(context.request, ACCOUNTS.viewer);
  return context;
}

test("the builds pipeline arrives with the seeded builds in every stage column", async ({ browser }) => {
  const context = await noScriptContext(browser);
  const pipeline = new BuildsPipeline(await context.newPage());
  const res = await pipeline.page.goto("/builds");
  expect(res?.status()).toBe(200);
  // db/seed/builds.ts puts one TC-1 build in each stage: 1.4.0 draft, 1.3.0 review,
  // 1.2.0 validation, 1.1.0 pilot, 1.0.0 production, 1.0.1 withdrawn.
  const seeded = { draft: "1.4.0", review: "1.3.0", validation: "1.2.0", pilot: "1.1.0", production: "1.0.0", withdrawn: "1.0.1" } as const;
  for (const stage of BuildsPipeline.stages) {
    const column = pipeline.column(stage);
    await expect(column.locator('a[href^="/builds/"]').filter({ hasText: seeded[stage] }).first()).toBeAttached();
    // The client's own loading placeholders would mean the rows were left to the browser.
    await expect(column.locator(".animate-pulse")).toHaveCount(0);
  }
  await context.close();
});

test("the profile list arrives with its first page of rows, the same rows the API answers", async ({ browser }) => {
  const context = await noScriptContext(browser);
  const list = new ProfilesList(await context.newPage());
  const res = await list.page.goto("/profiles");
  expect(res?.status()).toBe(200);
  const rows = list.page.locator("table").filter({ has: list.page.locator("caption", { hasText: "Profiles" }) }).locator("tbody tr");
  // "Balanced" is a seeded profile (db/seed/registry.ts) and sorts first by name.
  await expect(rows.locator('a[href^="/profiles/"]').filter({ hasText: "Balanced" })).toHaveCount(1);
  const api = (await (await context.request.get("/api/v1/profiles?dir=asc&page=1")).json()) as { items: { id: string; name: string }[]; total: number };
  expect(api.items.length).toBeGreaterThan(0);
  await expect(rows).toHaveCount(api.items.length);
  for (const p of api.items) await expect(rows.locator(`a[href="/profiles/${p.id}"]`)).toHaveText(p.name);
  await expect(list.page.getByTestId("pager-status").first()).toContainText(`${api.total} in all`);
  await context.close();
});
