/**
 * Characters that make a spreadsheet read a cell as a formula when they start it (OWASP
 * "CSV Injection": = + - @, tab and carriage return; a full-width ＝ is read as = by some).
 */
const FORMULA_START = "=+\\-@\\t\\r\uff1d";
/**
 * A formula starter at the beginning of the value, or after anything a spreadsheet may
 * take as the start of a new cell or token: a separator (, ; | tab), a quote, whitespace or
 * a line break. Checking only the first character misses `L;=cmd|' /C calc'!A0`, which
 * becomes a formula when the reader splits on ";".
 */
const FORMULA_ANYWHERE = new RegExp(`(^|[,;|\\s"'])[${FORMULA_START}]`);

/**
 * One CSV field (RFC 4180 §2). A value that could be read as a formula is prefixed with a
 * single quote and always quoted, as the OWASP guidance says, so neither its first character
 * nor a separator inside it can start a formula; other values are quoted when they hold a
 * comma, quote or line break.
 */
export function csvField(value: string): string {
  if (FORMULA_ANYWHERE.test(value)) return `"'${value.replace(/"/g, '""')}"`;
  return /[",;\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

export function toCsv(rows: readonly (readonly string[])[]): string {
  return rows.map((r) => r.map(csvField).join(",")).join("\r\n") + "\r\n";
}
