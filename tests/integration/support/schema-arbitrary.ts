import fc from "fast-check";

type JsonSchema = {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  items?: JsonSchema;
  enum?: unknown[];
  const?: unknown;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  format?: string;
  pattern?: string;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minLength?: number;
  maxLength?: number;
  minItems?: number;
  maxItems?: number;
  default?: unknown;
};

const ISO = fc.date({ min: new Date("2000-01-01"), max: new Date("2100-01-01"), noInvalidDate: true }).map((d) => d.toISOString());

/**
 * Values that satisfy a JSON Schema (the subset zod emits), for fuzzing with mostly-valid
 * requests. Patterns are not honoured; such strings are then simply invalid cases.
 */
export function arbitraryFromSchema(schema: JsonSchema, depth = 0): fc.Arbitrary<unknown> {
  if (schema.const !== undefined) return fc.constant(schema.const);
  if (schema.enum) return fc.constantFrom(...schema.enum);
  const alts = schema.anyOf ?? schema.oneOf;
  if (alts?.length) return fc.oneof(...alts.map((s) => arbitraryFromSchema(s, depth + 1)));
  const type = Array.isArray(schema.type) ? schema.type[0] : schema.type;
  switch (type) {
    case "object": {
      const props = schema.properties ?? {};
      const required = new Set(schema.required ?? []);
      const record: Record<string, fc.Arbitrary<unknown>> = {};
      for (const [k, s] of Object.entries(props)) record[k] = depth > 4 ? fc.constant(null) : arbitraryFromSchema(s, depth + 1);
      return fc.record(record, { requiredKeys: [...required].filter((k) => k in record) });
    }
    case "array": {
      const item = schema.items ? arbitraryFromSchema(schema.items, depth + 1) : fc.jsonValue();
      return fc.array(item, { minLength: schema.minItems ?? 0, maxLength: Math.min(schema.maxItems ?? 5, 5) });
    }
    case "integer":
      return fc.integer({ min: Math.ceil(schema.minimum ?? schema.exclusiveMinimum ?? -1000), max: Math.floor(schema.maximum ?? schema.exclusiveMaximum ?? 100000) });
    case "number":
      return fc.double({ min: schema.minimum ?? -1e6, max: schema.maximum ?? 1e6, noNaN: true, noDefaultInfinity: true });
    case "boolean":
      return fc.boolean();
    case "null":
      return fc.constant(null);
    case "string": {
      if (schema.format === "uuid") return fc.uuid();
      if (schema.format === "email") return fc.emailAddress();
      if (schema.format === "date-time") return ISO;
      if (schema.format === "date") return ISO.map((s) => s.slice(0, 10));
      return fc.string({ minLength: schema.minLength ?? 0, maxLength: Math.min(schema.maxLength ?? 40, 40) });
    }
    default:
      return fc.jsonValue({ maxDepth: 2 });
  }
}

/** Hostile or malformed bodies: wrong types, prototype keys, deep nesting, huge numbers. */
export const hostileBody: fc.Arbitrary<unknown> = fc.oneof(
  fc.anything({ maxDepth: 3 }),
  fc.constant({ __proto__: { role: "admin" } }),
  fc.constant(JSON.parse('{"__proto__": {"isAdmin": true}, "constructor": {"prototype": {}}}') as unknown),
  fc.constant(Array.from({ length: 200 }).reduce<unknown>((acc) => ({ a: acc }), 1)),
  fc.constant({ n: Number.MAX_SAFE_INTEGER * 10, s: "\u0000\uffff", t: "💧".repeat(1000) }),
  fc.constant([]),
  fc.constant("just a string"),
  fc.constant(null),
);
