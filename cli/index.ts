import { EngineInputError } from "../lib/engine";
import { EXIT_CODES, UsageError, wantsHelp, wantsJson } from "./args";
import { COMMANDS } from "./commands";

const USAGE = [
  "Usage: loopkeeper <command> [arguments] [options]",
  "",
  "Commands:",
  ...(() => {
    const width = Math.max(...COMMANDS.map((c) => c.name.length)) + 2;
    return COMMANDS.map((c) => `  ${c.name.padEnd(width)}${c.summary}`);
  })(),
  "",
  "Run loopkeeper <command> --help for a command's options and an example.",
  EXIT_CODES,
].join("\n");

/** Runs one command; returns the exit code. Prints no stack traces. */
export function run(argv: readonly string[]): number {
  const [name, ...rest] = argv;
  const json = wantsJson(rest);
  const command = COMMANDS.find((c) => c.name === name);
  const fail = (code: 1 | 2, message: string): number => {
    if (json) process.stdout.write(`${JSON.stringify({ ok: false, error: message, exitCode: code })}\n`);
    else process.stderr.write(`${message}\n${code === 2 ? `\n${command ? `Usage: ${command.usage}\nRun loopkeeper ${command.name} --help for its options and an example.` : USAGE}\n` : ""}`);
    return code;
  };
  if (!name || name === "help" || name === "--help" || name === "-h") {
    const topic = name === "help" ? COMMANDS.find((c) => c.name === rest[0]) : undefined;
    process.stdout.write(`${topic ? topic.help : USAGE}\n`);
    return name ? 0 : 2;
  }
  if (!command) return fail(2, `Unknown command "${name}". Commands: ${COMMANDS.map((c) => c.name).join(", ")}.`);
  if (wantsHelp(rest)) {
    process.stdout.write(`${command.help}\n`);
    return 0;
  }
  try {
    const result = command.run(rest);
    if (json) process.stdout.write(`${JSON.stringify(result.json, null, 2)}\n`);
    else (result.exitCode === 0 ? process.stdout : process.stderr).write(`${result.human}\n`);
    return result.exitCode;
  } catch (e) {
    if (e instanceof UsageError) return fail(2, e.message);
    if (e instanceof EngineInputError) return fail(1, `Invalid input: ${e.message}`);
    return fail(1, `Internal error: ${e instanceof Error ? e.message : String(e)}`);
  }
}

process.exitCode = run(process.argv.slice(2));
