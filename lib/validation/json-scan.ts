/**
 * A small JSON scanner that records where each value sits in the text, keyed
 * by JSON pointer (RFC 6901), and where the first syntax error is. Recursion is
 * bounded by `maxDepth`, so hostile nesting cannot overflow the stack.
 */

export interface ValueSpan {
  /** Offset of the value's first character. */
  start: number;
  /** Offset just after the value's last character. */
  end: number;
  /** For object members: offsets of the key string, quotes included. */
  keyStart?: number;
  keyEnd?: number;
}

export interface JsonScan {
  spans: Map<string, ValueSpan>;
  syntaxError?: { offset: number; message: string };
  /** Pointers of members whose key appeared twice in the same object. */
  duplicateKeys: string[];
}

/** Escapes one pointer segment: "~" → "~0", "/" → "~1". */
export function escapePointerSegment(segment: string): string {
  return segment.replace(/~/g, "~0").replace(/\//g, "~1");
}

class ScanError extends Error {
  constructor(
    readonly offset: number,
    message: string,
  ) {
    super(message);
  }
}

const NUMBER_RE = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
// JSON forbids raw control characters inside strings (RFC 8259 §7), so the class names them.
// eslint-disable-next-line no-control-regex
const STRING_BODY_RE = /(?:[^"\\\u0000-\u001f]|\\(?:["\\/bfnrt]|u[0-9a-fA-F]{4}))*/y;

class Scanner {
  pos = 0;
  readonly spans = new Map<string, ValueSpan>();
  readonly duplicateKeys: string[] = [];

  constructor(
    private readonly text: string,
    private readonly maxDepth: number,
  ) {}

  private ws(): void {
    const t = this.text;
    while (this.pos < t.length) {
      const c = t.charCodeAt(this.pos);
      if (c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d) this.pos++;
      else break;
    }
  }

  private fail(message: string, offset = this.pos): never {
    throw new ScanError(offset, message);
  }

  private describeHere(): string {
    if (this.pos >= this.text.length) return "the end of the text";
    return `"${this.text.slice(this.pos, this.pos + 12).split(/[\r\n]/)[0]}"`;
  }

  string(): string {
    const start = this.pos;
    this.pos++; // opening quote
    STRING_BODY_RE.lastIndex = this.pos;
    STRING_BODY_RE.exec(this.text);
    this.pos = STRING_BODY_RE.lastIndex;
    if (this.text[this.pos] !== '"') {
      if (this.pos >= this.text.length) this.fail("Unterminated string: add the closing quote.", start);
      this.fail("Invalid character in string: escape it (\\n, \\\\, \\\" or \\uXXXX).");
    }
    this.pos++;
    return JSON.parse(this.text.slice(start, this.pos)) as string;
  }

  value(pointer: string, depth: number, key?: { start: number; end: number }): void {
    if (depth > this.maxDepth) this.fail(`Nesting deeper than ${this.maxDepth} levels; a profile needs only a few.`);
    this.ws();
    const start = this.pos;
    const c = this.text[this.pos];
    if (c === "{") this.object(pointer, depth);
    else if (c === "[") this.array(pointer, depth);
    else if (c === '"') this.string();
    else if (c === "t" || c === "f" || c === "n") {
      const word = c === "t" ? "true" : c === "f" ? "false" : "null";
      if (!this.text.startsWith(word, this.pos)) this.fail(`Unexpected ${this.describeHere()}: expected a value.`);
      this.pos += word.length;
    } else {
      NUMBER_RE.lastIndex = this.pos;
      const m = NUMBER_RE.exec(this.text);
      if (!m || m[0].length === 0) {
        const hint = /^(NaN|-?Infinity)/.test(this.text.slice(this.pos)) ? " (NaN and Infinity are not JSON: write a number)" : "";
        this.fail(`Unexpected ${this.describeHere()}: expected a value${hint}.`);
      }
      this.pos += m[0].length;
    }
    this.spans.set(pointer, { start, end: this.pos, ...(key ? { keyStart: key.start, keyEnd: key.end } : {}) });
  }

  private object(pointer: string, depth: number): void {
    this.pos++;
    this.ws();
    const seen = new Set<string>();
    if (this.text[this.pos] === "}") {
      this.pos++;
      return;
    }
    for (;;) {
      this.ws();
      if (this.text[this.pos] !== '"') this.fail(`Expected a property name in double quotes, found ${this.describeHere()}.`);
      const keyStart = this.pos;
      const key = this.string();
      const keyEnd = this.pos;
      const child = `${pointer}/${escapePointerSegment(key)}`;
      if (seen.has(key)) this.duplicateKeys.push(child);
      seen.add(key);
      this.ws();
      if (this.text[this.pos] !== ":") this.fail(`Expected ":" after property name "${key}".`);
      this.pos++;
      this.value(child, depth + 1, { start: keyStart, end: keyEnd });
      this.ws();
      const d = this.text[this.pos];
      if (d === ",") {
        this.pos++;
        continue;
      }
      if (d === "}") {
        this.pos++;
        return;
      }
      this.fail(`Expected "," or "}" after a property value, found ${this.describeHere()}.`);
    }
  }

  private array(pointer: string, depth: number): void {
    this.pos++;
    this.ws();
    if (this.text[this.pos] === "]") {
      this.pos++;
      return;
    }
    for (let i = 0; ; i++) {
      this.value(`${pointer}/${i}`, depth + 1);
      this.ws();
      const d = this.text[this.pos];
      if (d === ",") {
        this.pos++;
        continue;
      }
      if (d === "]") {
        this.pos++;
        return;
      }
      this.fail(`Expected "," or "]" after an array item, found ${this.describeHere()}.`);
    }
  }

  document(): void {
    this.value("", 0);
    this.ws();
    if (this.pos < this.text.length) this.fail(`Unexpected ${this.describeHere()} after the end of the document.`);
  }
}

/**
 * The last text scanned and its scan. The editor scans each text twice: when validating it, and
 * when a handle on the plot then writes into it (lib/curve-edit); the second is this one. A scan is
 * never changed by its readers.
 */
let lastScan: { text: string; maxDepth: number; scan: JsonScan } | null = null;

/** Scans JSON text; never throws. */
export function scanJson(text: string, maxDepth = 64): JsonScan {
  if (lastScan && lastScan.maxDepth === maxDepth && lastScan.text === text) return lastScan.scan;
  const scan = scanUncached(text, maxDepth);
  lastScan = { text, maxDepth, scan };
  return scan;
}

function scanUncached(text: string, maxDepth: number): JsonScan {
  const scanner = new Scanner(text, maxDepth);
  try {
    scanner.document();
    return { spans: scanner.spans, duplicateKeys: scanner.duplicateKeys };
  } catch (e) {
    const offset = e instanceof ScanError ? e.offset : scanner.pos;
    const message = e instanceof ScanError ? e.message : "The text could not be read as JSON.";
    return { spans: scanner.spans, duplicateKeys: scanner.duplicateKeys, syntaxError: { offset, message } };
  }
}
