import { describe, expect, it } from "vitest";
import { z } from "zod";
import { buildOpenApi } from "@/lib/api/openapi";
import { allOperations } from "@/lib/api/operations";
import { defineOperation } from "@/lib/api/operation";

describe("OpenAPI generation", () => {
  it("puts every operation at its path and method, once", () => {
    const doc = buildOpenApi(allOperations, "0.0.0") as { paths: Record<string, Record<string, { operationId: string }>> };
    const seen = Object.entries(doc.paths).flatMap(([, item]) => Object.values(item).map((o) => o.operationId));
    expect(seen.sort()).toEqual(allOperations.map((o) => o.id).sort());
    expect(new Set(seen).size).toBe(seen.length);
  });

  it("derives parameters and bodies from the zod schemas", () => {
    const op = defineOperation({
      id: "probe",
      method: "PATCH",
      path: "/api/v1/probe/{id}",
      summary: "probe",
      tag: "Test",
      access: "admin",
      params: z.strictObject({ id: z.uuid() }),
      query: z.strictObject({ page: z.coerce.number().int().default(1), q: z.string().optional() }),
      body: z.strictObject({ dutyPct: z.number().min(0).max(100) }),
      response: z.object({ dutyPct: z.number() }),
    });
    const doc = buildOpenApi([op], "1.2.3") as {
      info: { version: string };
      paths: Record<string, Record<string, { parameters: { name: string; in: string; required: boolean }[]; requestBody: { content: Record<string, { schema: { properties: Record<string, { maximum?: number }>; additionalProperties?: boolean } }> } }>>;
    };
    const item = doc.paths["/api/v1/probe/{id}"]!.patch!;
    expect(doc.info.version).toBe("1.2.3");
    expect(item.parameters).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ name: "id", in: "path", required: true }),
        expect.objectContaining({ name: "q", in: "query", required: false }),
      ]),
    );
    const body = item.requestBody.content["application/json"]!.schema;
    expect(body.properties.dutyPct!.maximum).toBe(100);
    expect(body.additionalProperties).toBe(false);
  });
});
