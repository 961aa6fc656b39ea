/**
 * The one CSV reader: lots files, lab measurement files and tests reading exports back all
 * go through it, so a quoted comma or line break means the same everywhere.
 */

export interface CsvRecord {
  /** The 1-based line the record starts on (a quoted field may span lines). */
  line: number;
  fields: string[];
}

/** The text without a leading byte order mark (spreadsheets write one). */
export function withoutBom(text: string): string {
  return text.replace(/^\uFEFF/, "");
}

/**
 * Splits CSV text into records (RFC 4180: comma separated, double-quoted fields may
 * hold commas, newlines and doubled quotes; CRLF or LF line ends). Returns each
 * record with the 1-based line it starts on.
 */
export function splitCsv(text: string): CsvRecord[] {
  const out: CsvRecord[] = [];
  let fields: string[] = [];
  let field = "";
  let quoted = false;
  let line = 1;
  let startLine = 1;
  let sawAny = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i++;
        } else quoted = false;
      } else {
        if (ch === "\n") line++;
        field += ch;
      }
      continue;
    }
    if (ch === '"' && field === "") {
      quoted = true;
      sawAny = true;
    } else if (ch === ",") {
      fields.push(field);
      field = "";
      sawAny = true;
    } else if (ch === "\n" || ch === "\r") {
      if (ch === "\r" && text[i + 1] === "\n") i++;
      fields.push(field);
      if (sawAny || fields.some((f) => f !== "")) out.push({ line: startLine, fields });
      fields = [];
      field = "";
      sawAny = false;
      line++;
      startLine = line;
    } else {
      field += ch;
      sawAny = true;
    }
  }
  fields.push(field);
  if (sawAny || fields.some((f) => f !== "")) out.push({ line: startLine, fields });
  return out;
}

