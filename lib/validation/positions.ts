import { scanJson, type JsonScan } from "./json-scan";

/** 1-based line and column (UTF-16 code units), as editors count them. */
export interface TextPosition {
  line: number;
  column: number;
}

export interface TextRange {
  start: TextPosition;
  end: TextPosition;
}

/** Offsets at which each line starts. */
export function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) starts.push(i + 1);
  return starts;
}

/** Line and column of a character offset (clamped to the text). */
export function offsetToPosition(starts: readonly number[], offset: number): TextPosition {
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid]! <= offset) lo = mid;
    else hi = mid - 1;
  }
  return { line: lo + 1, column: offset - starts[lo]! + 1 };
}

/**
 * Offset of a JSON.parse error, from the engines' messages ("at position N",
 * or "line L column C"); undefined when the message gives none.
 */
export function offsetFromParseError(message: string, starts: readonly number[]): number | undefined {
  const pos = /position (\d+)/.exec(message);
  if (pos) return Number(pos[1]);
  const lc = /line (\d+) column (\d+)/.exec(message);
  if (lc) {
    const lineStart = starts[Number(lc[1]) - 1];
    if (lineStart !== undefined) return lineStart + Number(lc[2]) - 1;
  }
  return undefined;
}

/** Finds text ranges of JSON pointers in one document; build once, ask many times. */
export class PointerLocator {
  private readonly starts: number[];
  private readonly scan: JsonScan;

  constructor(text: string, scan?: JsonScan) {
    this.starts = lineStarts(text);
    this.scan = scan ?? scanJson(text);
  }

  position(offset: number): TextPosition {
    return offsetToPosition(this.starts, offset);
  }

  /**
   * Range of the value at `pointer` (or of its key when `preferKey`). Falls back
   * to the nearest ancestor that exists, so a missing property marks its
   * parent object. Null when not even the root could be read.
   */
  range(pointer: string, preferKey = false): TextRange | null {
    let p = pointer;
    for (;;) {
      const span = this.scan.spans.get(p);
      if (span) {
        const useKey = preferKey && span.keyStart !== undefined && span.keyEnd !== undefined;
        const start = useKey ? span.keyStart! : span.start;
        const end = useKey ? span.keyEnd! : span.end;
        return { start: this.position(start), end: this.position(end) };
      }
      if (p === "") return null;
      p = p.slice(0, p.lastIndexOf("/"));
    }
  }
}

/**
 * Line/column range of the value a JSON pointer names in JSON text, for editor
 * markers; the nearest existing ancestor when the pointer names nothing.
 */
export function pointerToRange(text: string, pointer: string): TextRange | null {
  return new PointerLocator(text).range(pointer);
}
