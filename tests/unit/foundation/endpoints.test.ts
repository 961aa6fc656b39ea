import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import * as endpoints from "@/lib/api/endpoints";
import { responseKind, type Endpoint } from "@/lib/api/endpoint";
import { allOperations } from "@/lib/api/operations";
import { operationKey, operationUrl } from "@/lib/api/client";
import { ENDPOINTS_FILE, endpointsSource } from "@/scripts/compile-endpoints";

/** The browser's endpoints are generated from the operations; these checks fail while they are stale. */
describe("endpoints (the operations as the browser calls them)", () => {
  const list = Object.values(endpoints) as Endpoint[];

  it("lib/api/endpoints.ts is what the generator writes for the operations as they are (run `npm run endpoints:compile`)", () => {
    expect(readFileSync(ENDPOINTS_FILE, "utf8")).toBe(endpointsSource());
  });

  it("has one endpoint per operation, with the operation's id, method, path and kind of answer", () => {
    expect(list.length).toBe(allOperations.length);
    expect(allOperations.length).toBeGreaterThan(40);
    const byId = new Map(list.map((e) => [e.id, e]));
    for (const op of allOperations) {
      expect(byId.get(op.id), op.id).toEqual({ id: op.id, method: op.method, path: op.path, response: responseKind(op.response) });
    }
  });

  it("names the same URL and query key as the operation (the server's first data and the browser's query meet)", () => {
    const op = allOperations.find((o) => o.path.includes("{id}") && o.method === "GET")!;
    const ep = list.find((e) => e.id === op.id)!;
    const input = { params: { id: "0b9f2a4e-4a8f-4f65-9a55-2f1f0d3c6b71" }, query: { page: 2 } };
    expect(operationUrl(ep, input)).toBe(operationUrl(op, input));
    expect(operationKey(ep, input)).toEqual(operationKey(op, input));
  });
});
