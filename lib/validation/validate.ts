import type { HardwareContext } from "../hardware/types";
import type { CoolingProfile } from "../profile/types";
import { hardwareRuleIssues } from "./hardware-rules";
import { hostileValueIssues } from "./hostile";
import { scanJson } from "./json-scan";
import { lineStarts, offsetFromParseError, PointerLocator } from "./positions";
import { profileRuleIssues } from "./profile-rules";
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

function validateDoc<T>(doc: unknown, schemaIssues: (d: unknown) => ValidationIssue[], rules: (d: T) => ValidationIssue[]): ValidationResult<T> {
  try {
    const hostile = hostileValueIssues(doc);
    if (hostile.length > 0) return { ok: false, issues: hostile };
    const schema = schemaIssues(doc);
    if (schema.length > 0) return { ok: false, issues: schema };
    const issues = rules(doc as T);
    return { ok: !hasErrors(issues), issues, value: doc as T };
  } catch (e) {
    return { ok: false, issues: [internalIssue(e)] };
  }
}

/**
 * Validates a profile document: JSON Schema (draft 2020-12) first, then the
 * semantic rules (profileRuleIssues), with board and component limits when a
 * hardware context is given (it should have passed validateHardware). Semantic
 * rules run only on a document that passed the schema. Never throws.
 */
export function validateProfile(doc: unknown, hardware?: HardwareContext): ValidationResult<CoolingProfile> {
  return validateDoc<CoolingProfile>(doc, profileSchemaIssues, (d) => profileRuleIssues(d, hardware));
}

/** Validates a hardware context document: JSON Schema, then semantic rules. Never throws. */
export function validateHardware(doc: unknown): ValidationResult<HardwareContext> {
  return validateDoc<HardwareContext>(doc, hardwareSchemaIssues, hardwareRuleIssues);
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
