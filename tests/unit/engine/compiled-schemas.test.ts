// The validators the app runs are Ajv's standalone code generated ahead of time from schemas/
// (so no screen needs eval). These checks hold them to the schemas: the committed file is what
// the generator makes from today's schemas, and it judges documents exactly as Ajv compiling the
// same schema at run time does (Ajv is the reference implementation here, a library outside ours).
import fs from "node:fs";
import path from "node:path";
import Ajv2020 from "ajv/dist/2020";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import profileSchema from "@/schemas/cooling-profile.schema.json";
import hardwareSchema from "@/schemas/hardware-context.schema.json";
import { hardware, profile } from "@/lib/validation/generated/schema-validators";

type Validate = { (d: unknown): boolean; errors?: unknown };

describe("compiled JSON Schema validators", () => {
  it("are what scripts/compile-schemas.mjs generates from the current schemas (run `npm run schemas:compile` after changing one)", async () => {
    const { compileSchemas, OUTPUT } = (await import(path.resolve("scripts/compile-schemas.mjs"))) as { compileSchemas: () => string; OUTPUT: string };
    expect(fs.readFileSync(OUTPUT, "utf8"), "run `npm run schemas:compile`").toBe(compileSchemas());
  });

  const ajv = new Ajv2020({ allErrors: true, strict: true, strictTypes: false, messages: true });
  const runtime = { profile: ajv.compile(profileSchema), hardware: ajv.compile(hardwareSchema) };
  const examples = fs.readdirSync("examples").filter((f) => f.endsWith(".json"));
  const docs = examples.map((f) => ({ f, doc: JSON.parse(fs.readFileSync(path.join("examples", f), "utf8")) as Record<string, unknown> }));

  function agree(compiled: Validate, reference: Validate, doc: unknown) {
    const a = compiled(doc);
    const b = reference(doc);
    expect(a).toBe(b);
    expect(JSON.stringify(compiled.errors ?? null)).toBe(JSON.stringify(reference.errors ?? null));
    return a;
  }

  it("judge the shipped examples like Ajv compiling at run time, errors included", () => {
    expect(docs.length).toBeGreaterThanOrEqual(3);
    for (const { f, doc } of docs) {
      const isHardware = f.includes("hardware");
      expect(agree(isHardware ? hardware : profile, isHardware ? runtime.hardware : runtime.profile, doc), f).toBe(true);
    }
  });

  it("judge mutated documents (values replaced at random paths) exactly like the run-time compiled schema", () => {
    const profiles = docs.filter((d) => !d.f.includes("hardware")).map((d) => d.doc);
    const junk = fc.oneof(fc.integer({ min: -1000, max: 1000 }), fc.double({ noNaN: true }), fc.string({ maxLength: 80 }), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 40 }), fc.dictionary(fc.string({ maxLength: 8 }), fc.integer(), { maxKeys: 5 }));
    let invalid = 0;
    fc.assert(
      fc.property(fc.constantFrom(...profiles), fc.array(fc.tuple(fc.nat(), junk), { minLength: 1, maxLength: 6 }), (base, edits) => {
        const doc = structuredClone(base);
        for (const [n, value] of edits) {
          // Walk to a random container and set a random existing key (or a new one) to junk.
          let node: unknown = doc;
          let depth = n % 4;
          while (depth-- > 0 && node && typeof node === "object") {
            const keys = Object.keys(node);
            const child = (node as Record<string, unknown>)[keys[n % keys.length]!];
            if (!child || typeof child !== "object") break;
            node = child;
          }
          if (node && typeof node === "object") {
            const keys = Object.keys(node);
            const key = n % 7 === 0 ? `extra${n}` : keys[n % Math.max(1, keys.length)] ?? "extra";
            (node as Record<string, unknown>)[key] = value;
          }
        }
        if (!agree(profile, runtime.profile, doc)) invalid++;
      }),
      { numRuns: 300, seed: 20261202 },
    );
    expect(invalid).toBeGreaterThan(100);
  });
});
