import { mkdirSync } from "node:fs";
import path from "node:path";
import { cReferenceFiles } from "../../lib/firmware";
import { defineCommand, UsageError } from "../args";
import { writeOutput, type CommandResult } from "../io";

/** `header`: the C99 bank layout header and the reference decoder and control law. */
export const headerCommand = defineCommand({
  name: "header",
  summary: "write the C99 header of the bank layout (offsets, structs with _Static_assert, magic, format version, CRC-32 parameters) and a reference decoder and control law in C.",
  positionals: null,
  options: {
    out: { kind: "text", value: "DIR", description: "folder the .h and .c files are written to (created when missing)", required: true },
  },
  examples: ["header --out firmware/generated"],
  notes: ["Compiles warning-free with gcc -std=c99 -Wall -Wextra -Werror -pedantic. The decoder and control law reproduce every value of `loopkeeper vectors` (docs/firmware-vectors.md)."],
  run: (args) => header(args.text("out")!),
});

function header(dir: string): CommandResult {
  try {
    mkdirSync(dir, { recursive: true });
  } catch (e) {
    throw new UsageError(`${dir}: the folder cannot be created (${(e as NodeJS.ErrnoException).code ?? "error"}).`);
  }
  const files = cReferenceFiles().map((f) => ({ ...f, path: path.join(dir, f.name) }));
  for (const f of files) writeOutput(f.path, f.text);
  return { exitCode: 0, human: files.map((f) => `Wrote ${f.path}`).join("\n"), json: { ok: true, files: files.map((f) => f.path) } };
}
