import "server-only";
import pino, { type DestinationStream, type Logger } from "pino";

const REDACT = ["password", "*.password", "secret", "*.secret", "token", "*.token", "authorization", "*.authorization", "cookie", "*.cookie", "headers.authorization", "headers.cookie"];

/**
 * Structured JSON logs (pino) with a request id on every request and audit line; anything
 * that looks like a secret is redacted before it is written.
 */
export function createLogger(destination?: DestinationStream, level?: string): Logger {
  const options = {
    level: level ?? (process.env.LOOPKEEPER_LOG === "silent" ? "silent" : (process.env.LOG_LEVEL ?? "info")),
    base: { service: "loopkeeper" },
    redact: { paths: REDACT, censor: "[redacted]" },
  };
  return destination ? pino(options, destination) : pino(options);
}

export const logger = createLogger();
