import type { ErrorObject } from "ajv/dist/2020";
import { hardware, profile, type CompiledValidator } from "./generated/schema-validators";
import { escapePointerSegment } from "./json-scan";
import type { ValidationIssue } from "./types";

// The validators are Ajv's standalone code, compiled from schemas/ ahead of time by
// scripts/compile-schemas.mjs: nothing is compiled at run time, so the screens' policy needs no eval.

const lastSegment = (path: string): string => path.slice(path.lastIndexOf("/") + 1);

/** Turns one Ajv error into an issue with a stable code and a message saying how to fix it. */
function toIssue(e: ErrorObject): ValidationIssue {
  const path = e.instancePath;
  const field = lastSegment(path);
  const params = e.params as Record<string, unknown>;
  const issue = (code: string, message: string, at = path): ValidationIssue => ({ code, path: at, severity: "error", message });
  switch (e.keyword) {
    case "required":
      return issue("schema.missing_property", `Add the required property "${String(params.missingProperty)}".`);
    case "additionalProperties": {
      const name = String(params.additionalProperty);
      const at = `${path}/${escapePointerSegment(name)}`;
      if (path === "/pump" && name === "stopBelowTempC") {
        return issue("pump.stop_not_allowed", "A pump must never stop while the CPU makes heat: remove stopBelowTempC from the pump curve.", at);
      }
      return issue("schema.unknown_property", `"${name}" is not a property here: remove it or check its spelling.`, at);
    }
    case "type":
      return issue("schema.wrong_type", `Must be ${String(params.type)}; change the value's type.`);
    case "minimum":
    case "maximum":
    case "exclusiveMinimum":
    case "exclusiveMaximum": {
      const bound = `${e.keyword.startsWith("exclusive") ? "strictly " : ""}${e.keyword.endsWith("inimum") ? "at least" : "at most"} ${String(params.limit)}`;
      if (field === "dutyPct") return issue("curve.duty_out_of_range", `A duty is a percentage from 0 to 100: make it ${bound}.`);
      if (field === "tempC") return issue("curve.temp_out_of_range", `A curve temperature must be ${bound} °C.`);
      return issue("schema.out_of_range", `Must be ${bound}.`);
    }
    case "minItems":
      return issue("curve.too_few_points", `A curve needs at least ${String(params.limit)} points; add points.`);
    case "maxItems":
      return issue("curve.too_many_points", `A curve may have at most ${String(params.limit)} points; remove points.`);
    case "const":
      return issue("schema.unsupported_value", `Must be ${JSON.stringify(params.allowedValue)}.`);
    case "enum":
      return issue("schema.unsupported_value", `Must be one of ${JSON.stringify(params.allowedValues)}.`);
    case "pattern":
      return issue("schema.bad_format", field === "version" ? "Write the version as x.y.z, e.g. 2.1.0." : `Does not have the expected format (${String(params.pattern)}).`);
    case "minLength":
    case "maxLength":
      return issue("schema.bad_length", `Text ${e.message ?? "has the wrong length"}.`);
    default:
      return issue(`schema.${e.keyword}`, e.message ?? "Does not match the schema.");
  }
}

function run(validate: CompiledValidator, doc: unknown): ValidationIssue[] {
  if (validate(doc)) return [];
  const issues = (validate.errors ?? []).map(toIssue);
  // One issue per path and code: allErrors can repeat the same fault through $ref.
  const seen = new Set<string>();
  return issues.filter((i) => {
    const key = `${i.code} ${i.path}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/** JSON Schema (draft 2020-12) issues of a profile document. */
export const profileSchemaIssues = (doc: unknown): ValidationIssue[] => run(profile, doc);

/** JSON Schema (draft 2020-12) issues of a hardware context document. */
export const hardwareSchemaIssues = (doc: unknown): ValidationIssue[] => run(hardware, doc);
