import { z } from "zod";
import { isJsonResponse, type Operation, type ResponseSpec } from "./operation";
import { CAPABILITIES } from "@/lib/auth/roles";

type JsonSchema = Record<string, unknown>;

function schemaOf(t: z.ZodType, io: "input" | "output"): JsonSchema {
  return z.toJSONSchema(t, { io, unrepresentable: "any", target: "draft-2020-12" });
}

function parametersOf(op: Operation): unknown[] {
  const out: unknown[] = [];
  for (const [where, t] of [["path", op.params], ["query", op.query]] as const) {
    if (!t) continue;
    const js = schemaOf(t, "input");
    const props = (js.properties ?? {}) as Record<string, JsonSchema>;
    const required = new Set((js.required as string[] | undefined) ?? []);
    for (const [name, schema] of Object.entries(props)) {
      out.push({ name, in: where, required: where === "path" || required.has(name), schema });
    }
  }
  return out;
}

const errorResponse = {
  description: "Error",
  content: {
    "application/json": {
      schema: {
        type: "object",
        required: ["error"],
        properties: {
          error: {
            type: "object",
            required: ["code", "message"],
            properties: {
              code: { type: "string" },
              message: { type: "string" },
              issues: { type: "array", items: { type: "object", properties: { path: { type: "string" }, message: { type: "string" } } } },
            },
          },
        },
      },
    },
  },
};

function successResponse(r: ResponseSpec): JsonSchema {
  if (isJsonResponse(r)) return { description: "OK", content: { "application/json": { schema: schemaOf(r, "output") } } };
  if (r.kind === "file") return { description: r.description, content: Object.fromEntries(r.contentTypes.map((c) => [c, { schema: { type: "string", format: "binary" } }])) };
  return { description: "Done; no body." };
}

function accessText(op: Operation): string {
  if (op.access === "public") return "No sign-in needed.";
  if (op.access === "signed_in") return "Any signed-in user or API token.";
  return `Roles: ${CAPABILITIES[op.access].join(", ")}.`;
}

/** Builds the OpenAPI 3.1 document from the operations' zod schemas. */
export function buildOpenApi(ops: Operation[], version: string): JsonSchema {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const op of ops) {
    const item = (paths[op.path] ??= {});
    const responses: Record<string, unknown> = {
      [String(op.successStatus ?? 200)]: successResponse(op.response),
      default: errorResponse,
    };
    const requestBody = op.body
      ? { required: true, content: { "application/json": { schema: schemaOf(op.body, "input") } } }
      : op.rawBody
        ? { required: true, content: Object.fromEntries(op.rawBody.contentTypes.map((c) => [c, { schema: { type: "string", format: "binary" } }])) }
        : undefined;
    item[op.method.toLowerCase()] = {
      operationId: op.id,
      summary: op.summary,
      description: accessText(op),
      tags: [op.tag],
      ...(op.access === "public" ? { security: [] } : {}),
      parameters: parametersOf(op),
      ...(requestBody ? { requestBody } : {}),
      responses,
    };
  }
  return {
    openapi: "3.1.0",
    info: { title: "Loopkeeper API", version, description: "Registry of cooler-controller curves, boards, builds and shipped boards." },
    servers: [{ url: "/" }],
    components: {
      securitySchemes: {
        bearer: { type: "http", scheme: "bearer", description: "An API token created on the Account page." },
        session: { type: "apiKey", in: "cookie", name: "next-auth.session-token" },
      },
    },
    security: [{ bearer: [] }, { session: [] }],
    paths,
  };
}
