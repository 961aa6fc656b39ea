import "server-only";

type Fields = Record<string, unknown>;
const SECRET_KEYS = /pass(word)?|secret|token|authorization|cookie/i;

function scrub(fields: Fields): Fields {
  const out: Fields = {};
  for (const [k, v] of Object.entries(fields)) out[k] = SECRET_KEYS.test(k) && k !== "tokenId" ? "[redacted]" : v;
  return out;
}

function write(level: "info" | "warn" | "error", fields: Fields, msg: string) {
  if (process.env.LOOPKEEPER_LOG === "silent") return;
  const line = JSON.stringify({ level, time: new Date().toISOString(), msg, ...scrub(fields) });
  if (level === "error") console.error(line);
  else console.log(line);
}

/** Structured JSON lines with a request id; keys that look like secrets are redacted. */
export const logger = {
  info: (fields: Fields, msg: string) => write("info", fields, msg),
  warn: (fields: Fields, msg: string) => write("warn", fields, msg),
  error: (fields: Fields, msg: string) => write("error", fields, msg),
};
