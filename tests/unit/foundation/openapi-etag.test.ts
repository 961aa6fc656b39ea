import { describe, expect, it, vi } from "vitest";

// Count how often the document is generated: once per process is the point.
const built = vi.hoisted(() => ({ calls: 0 }));
vi.mock("@/lib/api/openapi", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/lib/api/openapi")>();
  return {
    ...real,
    buildOpenApi: (...args: Parameters<typeof real.buildOpenApi>) => {
      built.calls++;
      return real.buildOpenApi(...args);
    },
  };
});

const { GET } = await import("@/app/api/v1/openapi.json/route");
const { ifNoneMatchHits } = await import("@/lib/platform/http/etag");

const get = (headers: Record<string, string> = {}) => GET(new Request("http://127.0.0.1/api/v1/openapi.json", { headers }));

describe("OpenAPI document served once per process with an ETag", () => {
  it("generates the document on first use only and answers 304 to a matching If-None-Match", async () => {
    const first = get();
    expect(first.status).toBe(200);
    expect(first.headers.get("content-type")).toBe("application/json");
    const etag = first.headers.get("etag");
    expect(etag).toMatch(/^"[A-Za-z0-9_-]{32}"$/);
    const doc = (await first.json()) as { openapi: string; paths: Record<string, unknown> };
    expect(doc.openapi).toBe("3.1.0");
    expect(Object.keys(doc.paths).length).toBeGreaterThan(10);

    const again = get();
    expect(await again.text()).toBe(JSON.stringify(doc));
    expect(again.headers.get("etag")).toBe(etag);

    const revalidated = get({ "if-none-match": etag! });
    expect(revalidated.status).toBe(304);
    expect(await revalidated.text()).toBe("");
    expect(revalidated.headers.get("etag")).toBe(etag);

    // A tag of some other document (an older deployment) gets the full answer.
    expect(get({ "if-none-match": '"older-document"' }).status).toBe(200);
    expect(built.calls).toBe(1);
  });
});

describe("If-None-Match comparison", () => {
  // RFC 9110 (June 2022) §13.1.2: If-None-Match uses the weak comparison of §8.8.3.2;
  // the table there: W/"1"~W/"1" match, W/"1"~W/"2" no match, W/"1"~"1" match, "1"~"1" match.
  it("follows the weak comparison table of RFC 9110 §8.8.3.2", () => {
    expect(ifNoneMatchHits('W/"1"', 'W/"1"')).toBe(true);
    expect(ifNoneMatchHits('W/"1"', 'W/"2"')).toBe(false);
    expect(ifNoneMatchHits('W/"1"', '"1"')).toBe(true);
    expect(ifNoneMatchHits('"1"', '"1"')).toBe(true);
  });

  // RFC 9110 §13.1.2: the field is "*" or a list of entity tags.
  it("accepts * and lists, and nothing when the header is absent", () => {
    expect(ifNoneMatchHits("*", '"abc"')).toBe(true);
    expect(ifNoneMatchHits('"x", W/"abc" , "y"', '"abc"')).toBe(true);
    expect(ifNoneMatchHits('"x", "y"', '"abc"')).toBe(false);
    expect(ifNoneMatchHits(null, '"abc"')).toBe(false);
  });
});
