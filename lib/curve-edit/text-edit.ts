import type { CurveKind } from "../profile/types";
import { scanJson, type JsonScan, type ValueSpan } from "../validation/json-scan";

/** Replace `text.slice(start, end)` with `text`: offsets in UTF-16 code units, as editors count. */
export interface TextEdit {
  start: number;
  end: number;
  text: string;
}

/** Why a text edit could not be built (the document is not in the shape the edit needs). */
export class CurveEditError extends Error {
  override readonly name = "CurveEditError";
}

const NUMBER_TOKEN = /^-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?$/;

/** The text after one edit. */
export function applyTextEdit(text: string, edit: TextEdit): string {
  return text.slice(0, edit.start) + edit.text + text.slice(edit.end);
}

/**
 * A number as the author would type it: at most three decimals, no exponent,
 * no "-0". Editing steps are 0.5 and 0.1, so three decimals never lose a step;
 * rounding here also hides binary leftovers such as 0.1 + 0.2.
 */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) throw new CurveEditError(`${value} is not a finite number.`);
  const rounded = Math.round(value * 1000) / 1000;
  if (Object.is(rounded, -0) || rounded === 0) return "0";
  const text = rounded.toFixed(3).replace(/\.?0+$/, "");
  return text;
}

/** One scan of a document's text, to locate several values in it. */
export function scanDocument(text: string): JsonScan {
  const scan = scanJson(text);
  if (scan.syntaxError) throw new CurveEditError(`The JSON has a syntax error (${scan.syntaxError.message}): fix it in the text before editing on the plot.`);
  return scan;
}

function spanOf(scan: JsonScan, pointer: string): ValueSpan {
  const span = scan.spans.get(pointer);
  if (!span) throw new CurveEditError(`The document has no value at ${pointer}.`);
  return span;
}

/**
 * Where the number at a JSON pointer sits in the text (its token, nothing
 * around it). Throws when the pointer names no value or a value that is not a number.
 */
export function numberSpan(text: string, pointer: string, scan: JsonScan = scanDocument(text)): ValueSpan {
  const span = spanOf(scan, pointer);
  const token = text.slice(span.start, span.end);
  if (!NUMBER_TOKEN.test(token)) throw new CurveEditError(`The value at ${pointer} is ${token.slice(0, 20)}, not a number.`);
  return span;
}

/**
 * The edit that writes `value` over the number at `pointer` and changes nothing
 * else: key order, whitespace and line breaks stay as the author left them.
 */
export function setNumberEdit(text: string, pointer: string, value: number, scan?: JsonScan): TextEdit {
  const span = numberSpan(text, pointer, scan);
  return { start: span.start, end: span.end, text: formatNumber(value) };
}

const pointsPointer = (kind: CurveKind) => `/${kind}/points`;

function pointCount(scan: JsonScan, kind: CurveKind): number {
  let n = 0;
  while (scan.spans.has(`${pointsPointer(kind)}/${n}`)) n++;
  return n;
}

/**
 * The edit that inserts a point `{tempC, dutyPct}` so that it becomes point
 * `index` (0-based) of the curve. The new point copies the layout of an existing
 * one (its line breaks, indentation and key order) and the separator between two
 * existing points, so the text reads as if the author had typed it.
 */
export function insertPointEdit(text: string, kind: CurveKind, index: number, point: { tempC: number; dutyPct: number }): TextEdit {
  const scan = scanDocument(text);
  const n = pointCount(scan, kind);
  if (n === 0) throw new CurveEditError(`The ${kind} curve has no points to copy the layout from.`);
  if (!Number.isInteger(index) || index < 0 || index > n) throw new CurveEditError(`Point ${index + 1} cannot be inserted into a curve of ${n} points.`);
  const templateIndex = Math.min(index, n - 1);
  const template = spanOf(scan, `${pointsPointer(kind)}/${templateIndex}`);
  const temp = numberSpan(text, `${pointsPointer(kind)}/${templateIndex}/tempC`, scan);
  const duty = numberSpan(text, `${pointsPointer(kind)}/${templateIndex}/dutyPct`, scan);
  // Rebuild the template's text with the new numbers, replacing from the later span backwards.
  const parts = [
    { span: temp, value: formatNumber(point.tempC) },
    { span: duty, value: formatNumber(point.dutyPct) },
  ].sort((a, b) => b.span.start - a.span.start);
  let element = text.slice(template.start, template.end);
  for (const { span, value } of parts) element = element.slice(0, span.start - template.start) + value + element.slice(span.end - template.start);
  const separator = n >= 2 ? text.slice(spanOf(scan, `${pointsPointer(kind)}/0`).end, spanOf(scan, `${pointsPointer(kind)}/1`).start) : ", ";
  if (index < n) {
    const at = spanOf(scan, `${pointsPointer(kind)}/${index}`).start;
    return { start: at, end: at, text: element + separator };
  }
  const at = spanOf(scan, `${pointsPointer(kind)}/${n - 1}`).end;
  return { start: at, end: at, text: separator + element };
}

/** The edit that removes point `index` (0-based) with one separator, leaving the rest of the text as it was. */
export function removePointEdit(text: string, kind: CurveKind, index: number): TextEdit {
  const scan = scanDocument(text);
  const n = pointCount(scan, kind);
  if (!Number.isInteger(index) || index < 0 || index >= n) throw new CurveEditError(`The ${kind} curve has no point ${index + 1}.`);
  const own = spanOf(scan, `${pointsPointer(kind)}/${index}`);
  if (index < n - 1) return { start: own.start, end: spanOf(scan, `${pointsPointer(kind)}/${index + 1}`).start, text: "" };
  if (index > 0) return { start: spanOf(scan, `${pointsPointer(kind)}/${index - 1}`).end, end: own.end, text: "" };
  return { start: own.start, end: own.end, text: "" };
}

const isHighSurrogate = (code: number) => code >= 0xd800 && code <= 0xdbff;
const isLowSurrogate = (code: number) => code >= 0xdc00 && code <= 0xdfff;

/**
 * The one span of `before` to replace so that it reads `after`: the common beginning and end
 * are kept (never splitting a surrogate pair or a CR LF). Null when the texts are equal.
 */
export function changedSpan(before: string, after: string): TextEdit | null {
  if (before === after) return null;
  const max = Math.min(before.length, after.length);
  let start = 0;
  while (start < max && before.charCodeAt(start) === after.charCodeAt(start)) start++;
  if (start > 0 && (isHighSurrogate(before.charCodeAt(start - 1)) || (before.charCodeAt(start - 1) === 13 && before.charCodeAt(start) === 10))) start--;
  let end = before.length;
  let endAfter = after.length;
  while (end > start && endAfter > start && before.charCodeAt(end - 1) === after.charCodeAt(endAfter - 1)) {
    end--;
    endAfter--;
  }
  if (end < before.length && end > 0 && (isLowSurrogate(before.charCodeAt(end)) || (before.charCodeAt(end) === 10 && before.charCodeAt(end - 1) === 13))) {
    end++;
    endAfter++;
  }
  return { start, end, text: after.slice(start, endAfter) };
}
