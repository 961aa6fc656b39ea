import { expect, test, type APIRequestContext } from "@playwright/test";
import { ACCOUNTS, signInRequest } from "./support/accounts";
import { BuildsPipeline } from "./pages/builds";

/*
 * Lists render their rows on the server: the first HTML response already holds them. The
 * pages are fetched here over plain HTTP with a signed-in cookie, so no script runs and
 * nothing could have fetched the rows after load. With a section's loading skeleton the
 * rows arrive later in the same response (streamed), so the whole body is read.
 */

/** The HTML between an element's opening tag (found by one of its attributes) and the end of the element named `tag`. */
function elementHtml(html: string, attribute: string, tag: string): string {
  const at = html.indexOf(attribute);
  expect(at, `${attribute} is in the HTML`).toBeGreaterThanOrEqual(0);
  const start = html.lastIndexOf(`<${tag}`, at);
  const end = html.indexOf(`</${tag}>`, at);
  expect(end).toBeGreaterThan(at);
  return html.slice(start, end);
}

/** What a reader sees of some HTML: tags and React's text separators dropped, entities of the seeded names decoded. */
function visibleText(html: string): string {
  return html
    .replace(/<!--.*?-->/g, "")
    .replace(/<[^>]+>/g, " ")
    .replace(/&amp;/g, "&")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&#x27;|&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/\s+/g, " ");
}

async function firstHtml(request: APIRequestContext, path: string): Promise<string> {
  const res = await request.get(path, { headers: { accept: "text/html" } });
  expect(res.status()).toBe(200);
  expect(res.headers()["content-type"]).toContain("text/html");
  return res.text();
}

test("the builds pipeline's HTML holds every build in its stage column", async ({ request }) => {
  await signInRequest(request, ACCOUNTS.viewer);
  const html = await firstHtml(request, "/builds");
  const api = (await (await request.get("/api/v1/builds")).json()) as { items: { id: string; stage: string; version: string }[] };
  // db/seed/builds.ts puts one TC-1 build in each stage: 1.4.0 draft, 1.3.0 review,
  // 1.2.0 validation, 1.1.0 pilot, 1.0.0 production, 1.0.1 withdrawn.
  const seeded = { draft: "1.4.0", review: "1.3.0", validation: "1.2.0", pilot: "1.1.0", production: "1.0.0", withdrawn: "1.0.1" } as const;
  for (const stage of BuildsPipeline.stages) {
    const column = elementHtml(html, `data-testid="pipeline-${stage}"`, "section");
    expect(visibleText(column), `the ${stage} column`).toContain(seeded[stage]);
    // The client's own loading placeholders would mean the rows were left to the browser.
    expect(column).not.toContain("animate-pulse");
    const inStage = api.items.filter((b) => b.stage === stage);
    expect(inStage.length).toBeGreaterThan(0);
    for (const b of inStage) {
      const card = elementHtml(column, `href="/builds/${b.id}"`, "a");
      expect(visibleText(card)).toContain(b.version);
    }
  }
});

test("the profile list's HTML holds its first page of rows, the rows the API answers", async ({ request }) => {
  await signInRequest(request, ACCOUNTS.viewer);
  const html = await firstHtml(request, "/profiles");
  const table = elementHtml(html, ">Profiles</caption>", "table");
  const body = elementHtml(table, "<tbody", "tbody");
  // "Balanced" is a seeded profile (db/seed/registry.ts) and sorts first by name.
  expect(visibleText(body)).toContain("Balanced");
  const api = (await (await request.get("/api/v1/profiles?dir=asc&page=1")).json()) as { items: { id: string; name: string }[]; total: number };
  expect(api.items.length).toBeGreaterThan(0);
  expect(body.match(/<tr[\s>]/g) ?? []).toHaveLength(api.items.length);
  for (const p of api.items) {
    const link = elementHtml(body, `href="/profiles/${p.id}"`, "a");
    expect(visibleText(link).trim()).toBe(p.name);
  }
  expect(visibleText(elementHtml(html, 'data-testid="pager-status"', "span"))).toContain(`${api.total} in all`);
});
