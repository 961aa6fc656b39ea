import type { HardwareContext } from "../hardware/types";
import type { CoolingProfile } from "../profile/types";
import { hardwareRuleIssues, type ReadableHardware } from "./hardware-rules";
import { hostileValueIssues } from "./hostile";
import { scanJson } from "./json-scan";
import { lineStarts, offsetFromParseError, PointerLocator } from "./positions";
import { profileRuleIssues, type ReadableProfile } from "./profile-rules";
import { hardwareSchemaIssues, profileSchemaIssues } from "./schema";
import type { ValidationIssue, ValidationResult } from "./types";

/** Longest document text accepted, characters. */
export const MAX_TEXT_LENGTH = 1_000_000;

const hasErrors = (issues: readonly ValidationIssue[]): boolean => issues.some((i) => i.severity === "error");

function internalIssue(e: unknown): ValidationIssue {
  // Not expected; kept so that validation never throws into an editor or a request.
  const detail = e instanceof Error ? e.name : typeof e;
  return { code: "internal.error", path: "", severity: "error", message: `Validation stopped on an internal error (${detail}); please report it with the document.` };
}

/** Schema findings that concern only a property the part does not need; the rest of the part can still be read. */
const DOES_NOT_SPOIL_PART = new Set(["schema.unknown_property", "pump.stop_not_allowed"]);

/**
 * The top-level parts of `doc` that passed their part of the schema: present, and no
 * schema issue at or below them (an unknown extra property does not count). The rules
 * then run on these, so one pass shows the schema errors and the rule errors of the
 * parts that could be read.
 */
function readableParts<P extends object>(doc: unknown, keys: readonly (keyof P & string)[], schema: readonly ValidationIssue[]): Partial<P> {
  const parts: Partial<P> = {};
  if (typeof doc !== "object" || doc === null || Array.isArray(doc)) return parts;
  for (const key of keys) {
    if (!Object.prototype.hasOwnProperty.call(doc, key)) continue;
    const at = `/${key}`;
    const spoiled = schema.some((i) => !DOES_NOT_SPOIL_PART.has(i.code) && (i.path === at || i.path.startsWith(`${at}/`)));
    if (!spoiled) parts[key] = (doc as P)[key];
  }
  return parts;
}

const PROFILE_PARTS = ["criticalTempC", "sensorLossDutyPct", "pump", "fans"] as const;
const HARDWARE_PARTS = ["fan", "pump", "radiator", "boardRevision"] as const;

function validateDoc<T>(doc: unknown, schemaIssues: (d: unknown) => ValidationIssue[], rules: (d: T) => ValidationIssue[], partRules: (d: unknown, schema: readonly ValidationIssue[]) => ValidationIssue[]): ValidationResult<T> {
  try {
    const hostile = hostileValueIssues(doc);
    if (hostile.length > 0) return { ok: false, issues: hostile };
    const schema = schemaIssues(doc);
    if (schema.length > 0) return { ok: false, issues: [...schema, ...partRules(doc, schema)] };
    const issues = rules(doc as T);
    return { ok: !hasErrors(issues), issues, value: doc as T };
  } catch (e) {
    return { ok: false, issues: [internalIssue(e)] };
  }
}

/**
 * Validates a profile document: JSON Schema (draft 2020-12) first, then the
 * semantic rules (profileRuleIssues), with board and component limits when a
 * hardware context is given (it should have passed validateHardware). When the
 * schema fails, the semantic rules still run on the parts that passed it (each
 * curve, the critical temperature, the sensor-loss duty), so one pass lists both.
 * `value` is set only when the whole document passed the schema. Never throws.
 */
export function validateProfile(doc: unknown, hardware?: HardwareContext): ValidationResult<CoolingProfile> {
  return validateDoc<CoolingProfile>(
    doc,
    profileSchemaIssues,
    (d) => profileRuleIssues(d, hardware),
    (d, schema) => profileRuleIssues(readableParts<ReadableProfile>(d, PROFILE_PARTS, schema), hardware),
  );
}

/** Validates a hardware context document: JSON Schema, then semantic rules (on the readable parts when the schema fails). Never throws. */
export function validateHardware(doc: unknown): ValidationResult<HardwareContext> {
  return validateDoc<HardwareContext>(doc, hardwareSchemaIssues, hardwareRuleIssues, (d, schema) => hardwareRuleIssues(readableParts<ReadableHardware>(d, HARDWARE_PARTS, schema)));
}

function validateText<T>(text: string, validate: (doc: unknown) => ValidationResult<T>): ValidationResult<T> {
  try {
    if (typeof text !== "string") {
      return { ok: false, issues: [{ code: "json.not_text", path: "", severity: "error", message: "Expected the document as text." }] };
    }
    if (text.length > MAX_TEXT_LENGTH) {
      return { ok: false, issues: [{ code: "json.too_large", path: "", severity: "error", message: `The text is ${text.length} characters; at most ${MAX_TEXT_LENGTH} are accepted.` }] };
    }
    const scan = scanJson(text);
    const locator = new PointerLocator(text, scan);
    let doc: unknown;
    let parseError: { offset: number; message: string } | undefined = scan.syntaxError;
    if (!parseError) {
      try {
        doc = JSON.parse(text);
      } catch (e) {
        const message = e instanceof Error ? e.message : "Invalid JSON.";
        parseError = { offset: offsetFromParseError(message, lineStarts(text)) ?? 0, message };
      }
    }
    if (parseError) {
      const at = locator.position(parseError.offset);
      return {
        ok: false,
        issues: [{ code: "json.syntax", path: "", severity: "error", message: `Line ${at.line}, column ${at.column}: ${parseError.message}`, range: { start: at, end: at } }],
      };
    }
    const result = validate(doc);
    const duplicates: ValidationIssue[] = scan.duplicateKeys.map((path) => ({
      code: "json.duplicate_key",
      path,
      severity: "warning",
      message: "This property appears twice in the same object; only the last one counts. Remove the other.",
    }));
    const issues = [...duplicates, ...result.issues].map((issue) => {
      const range = locator.range(issue.path, issue.code === "schema.unknown_property" || issue.code === "pump.stop_not_allowed" || issue.code === "json.duplicate_key");
      return range ? { ...issue, range } : issue;
    });
    return { ...result, ok: !hasErrors(issues), issues };
  } catch (e) {
    return { ok: false, issues: [internalIssue(e)] };
  }
}

/**
 * Parses and validates profile JSON text. Syntax errors carry line and column;
 * every other issue carries the text range of its JSON pointer. Never throws.
 */
export function validateProfileText(text: string, hardware?: HardwareContext): ValidationResult<CoolingProfile> {
  return validateText(text, (doc) => validateProfile(doc, hardware));
}

/** Parses and validates hardware context JSON text, like validateProfileText. */
export function validateHardwareText(text: string): ValidationResult<HardwareContext> {
  return validateText(text, validateHardware);
}
