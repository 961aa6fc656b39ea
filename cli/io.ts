import { readFileSync, writeFileSync } from "node:fs";
import type { ValidationIssue } from "../lib/engine";
import { UsageError } from "./args";

/** What a command hands back: exit code, human text and machine JSON. */
export interface CommandResult {
  exitCode: 0 | 1 | 2;
  human: string;
  json: unknown;
}

/** Reads a file as bytes; a missing or unreadable file is a usage error. */
export function readBytes(file: string): Uint8Array {
  try {
    return new Uint8Array(readFileSync(file));
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new UsageError(code === "ENOENT" ? `${file}: no such file.` : `${file}: cannot be read (${code ?? "error"}).`);
  }
}

/** Writes a file; an unwritable path is a usage error. */
export function writeOutput(file: string, data: Uint8Array | string): void {
  try {
    writeFileSync(file, data);
  } catch (e) {
    throw new UsageError(`${file}: cannot be written (${(e as NodeJS.ErrnoException).code ?? "error"}).`);
  }
}

export const readText = (file: string): string => new TextDecoder().decode(readBytes(file));

/** "file:line:col: error code (path): message" lines, as compilers print them. */
export function formatIssues(file: string, issues: readonly ValidationIssue[]): string {
  return issues
    .map((i) => {
      const where = i.range ? `${file}:${i.range.start.line}:${i.range.start.column}` : file;
      return `${where}: ${i.severity} ${i.code}${i.path ? ` (${i.path})` : ""}: ${i.message}`;
    })
    .join("\n");
}

/** Numbers for JSON output: -Infinity (silence) and Infinity become null. */
export function jsonSafe(value: unknown): unknown {
  return JSON.parse(JSON.stringify(value, (_k, v: unknown) => (typeof v === "number" && !Number.isFinite(v) ? null : v)));
}

export const fmtDb = (db: number): string => (Number.isFinite(db) ? `${db.toFixed(1)} dB(A)` : "silent");
