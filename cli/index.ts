import { EngineInputError } from "../lib/engine";
import { UsageError } from "./args";
import { BANK_USAGE, bankCommand } from "./commands/bank";
import { EVALUATE_USAGE, evaluateCommand } from "./commands/evaluate";
import { INSPECT_USAGE, inspectCommand } from "./commands/inspect";
import { TACH_USAGE, tachCommand } from "./commands/tach";
import { VALIDATE_USAGE, validateCommand } from "./commands/validate";
import type { CommandResult } from "./io";

const COMMANDS: Record<string, (argv: readonly string[]) => CommandResult> = {
  validate: validateCommand,
  evaluate: evaluateCommand,
  bank: bankCommand,
  inspect: inspectCommand,
  tach: tachCommand,
};

const USAGE = ["Usage: loopkeeper <command> …", ...[VALIDATE_USAGE, EVALUATE_USAGE, BANK_USAGE, INSPECT_USAGE, TACH_USAGE].map((u) => `  ${u}`), "Exit codes: 0 valid, 1 invalid input, 2 usage error."].join("\n");

/** Runs one command; returns the exit code. Prints no stack traces. */
export function run(argv: readonly string[]): number {
  const [name, ...rest] = argv;
  const json = rest.includes("--json");
  const fail = (code: 1 | 2, message: string): number => {
    if (json) process.stdout.write(`${JSON.stringify({ ok: false, error: message, exitCode: code })}\n`);
    else process.stderr.write(`${message}\n${code === 2 ? `\n${USAGE}\n` : ""}`);
    return code;
  };
  if (!name || name === "help" || name === "--help" || name === "-h") {
    process.stdout.write(`${USAGE}\n`);
    return name ? 0 : 2;
  }
  const command = COMMANDS[name];
  if (!command) return fail(2, `Unknown command "${name}".`);
  try {
    const result = command(rest);
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
