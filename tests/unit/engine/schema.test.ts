import { readFileSync } from "node:fs";
import path from "node:path";
import Ajv2020 from "ajv/dist/2020";
import { describe, expect, it } from "vitest";
import { quietProfile, exampleHardware } from "./fixtures";

const root = path.resolve(__dirname, "../../..");
const load = (f: string): Record<string, unknown> => JSON.parse(readFileSync(path.join(root, "schemas", f), "utf8")) as Record<string, unknown>;

/** Every property schema, wherever it sits, with its pointer. */
function propertySchemas(node: unknown, at = ""): [string, Record<string, unknown>][] {
  if (typeof node !== "object" || node === null) return [];
  const out: [string, Record<string, unknown>][] = [];
  const rec = node as Record<string, unknown>;
  if (rec.properties && typeof rec.properties === "object") {
    for (const [k, v] of Object.entries(rec.properties as Record<string, Record<string, unknown>>)) out.push([`${at}/properties/${k}`, v]);
  }
  for (const [k, v] of Object.entries(rec)) if (typeof v === "object") out.push(...propertySchemas(v, `${at}/${k}`));
  return out;
}

describe("JSON Schemas", () => {
  for (const file of ["cooling-profile.schema.json", "hardware-context.schema.json"]) {
    it(`${file} is draft 2020-12 with $id, and a title and description on every property`, () => {
      const schema = load(file);
      expect(schema.$schema).toBe("https://json-schema.org/draft/2020-12/schema");
      expect(String(schema.$id)).toMatch(/^https:\/\/.+\.schema\.json$/);
      const props = propertySchemas(schema);
      expect(props.length).toBeGreaterThan(10);
      for (const [where, p] of props) {
        expect(typeof p.title, where).toBe("string");
        expect(typeof p.description, where).toBe("string");
      }
      // Compiles under Ajv's strict mode (json-schema.org draft 2020-12 via ajv/dist/2020).
      expect(() => new Ajv2020({ strict: true, strictTypes: false }).compile(schema)).not.toThrow();
    });
  }

  it("names every field of the TypeScript types", () => {
    const profileProps = new Set(propertySchemas(load("cooling-profile.schema.json")).map(([w]) => w.split("/").at(-1)));
    const p = quietProfile();
    const used = [...Object.keys(p), ...Object.keys(p.pump), ...Object.keys(p.fans), ...Object.keys(p.pump.points[0]!)];
    for (const k of used) expect(profileProps.has(k), k).toBe(true);
    const hwProps = new Set(propertySchemas(load("hardware-context.schema.json")).map(([w]) => w.split("/").at(-1)));
    const hw = exampleHardware();
    for (const k of [...Object.keys(hw), ...Object.keys(hw.pump), ...Object.keys(hw.radiator), ...Object.keys(hw.boardRevision)]) expect(hwProps.has(k), k).toBe(true);
  });

  it("a pump curve has no stop temperature in the schema", () => {
    const defs = load("cooling-profile.schema.json").$defs as Record<string, { properties: Record<string, unknown> }>;
    expect(defs.pumpCurve!.properties.stopBelowTempC).toBeUndefined();
    expect(defs.fanCurve!.properties.stopBelowTempC).toBeDefined();
  });
});
