import { parseArgs as parseArgv } from "node:util";
import type { CommandResult } from "./io";

/** Thrown for a mistake in how the command was called (exit code 2). */
export class UsageError extends Error {}

/** One `--name` option of a command, as its help describes it. */
export interface OptionSpec {
  /** "flag" takes no value; "number" and "integer" are checked when read. */
  kind: "text" | "number" | "integer" | "flag";
  /** What the value is, shown in usage as `--name <value>`. */
  value?: string;
  description: string;
  required?: boolean;
  /** Shown in help as "(default …)"; the command applies it. */
  defaultText?: string;
}

/** Positional arguments a command takes, as its usage shows them. */
export interface PositionalSpec {
  /** e.g. "<profile.json>" or "<profile.json>..." */
  name: string;
  description: string;
  min: number;
  max: number;
}

/** Values read from the command line, checked against the command's options. */
export interface CommandArgs<K extends string> {
  positionals: string[];
  text(name: K): string | undefined;
  /** A finite number; a usage error names the option otherwise. */
  number(name: K): number | undefined;
  /** A whole number within [min, max]; a usage error names the option and range otherwise. */
  integer(name: K, range: { min: number; max: number; what: string }): number | undefined;
  flag(name: K): boolean;
}

/** A command: its options, help text and the work it does. */
export interface CommandSpec<K extends string> {
  name: string;
  /** One line: what the command does. */
  summary: string;
  positionals: PositionalSpec | null;
  options: Record<K, OptionSpec>;
  /** Whole command lines, without the leading "loopkeeper". */
  examples: string[];
  /** Extra paragraphs printed after the options (formulas, exit codes). */
  notes?: string[];
  run(args: CommandArgs<K>): CommandResult;
}

/** A command with its option names erased, as the dispatcher holds it. */
export interface CliCommand {
  name: string;
  summary: string;
  usage: string;
  help: string;
  /** Parses argv (usage errors thrown), then runs. */
  run(argv: readonly string[]): CommandResult;
}

/** Options every command accepts; the dispatcher handles them before the command runs. */
const COMMON_OPTIONS: Record<"json" | "help", OptionSpec> = {
  json: { kind: "flag", description: "print the result (or the error) as JSON on stdout" },
  help: { kind: "flag", description: "show this help and exit" },
};

export const EXIT_CODES = "Exit codes: 0 success, 1 invalid input (the file or numbers given), 2 usage error (how the command was called).";

const optionLabel = (name: string, o: OptionSpec): string => `--${name}${o.kind === "flag" ? "" : ` <${o.value ?? "value"}>`}`;

function usageLine<K extends string>(spec: CommandSpec<K>): string {
  const parts = [`loopkeeper ${spec.name}`];
  if (spec.positionals) parts.push(spec.positionals.min === 0 ? `[${spec.positionals.name}]` : spec.positionals.name);
  const entries = Object.entries<OptionSpec>(spec.options);
  for (const [name, o] of entries.filter(([, o]) => o.required)) parts.push(optionLabel(name, o));
  for (const [name, o] of entries.filter(([, o]) => !o.required)) parts.push(`[${optionLabel(name, o)}]`);
  parts.push("[--json]");
  return parts.join(" ");
}

function table(rows: readonly (readonly [string, string])[]): string[] {
  const width = Math.max(...rows.map(([left]) => left.length)) + 2;
  return rows.map(([left, right]) => `  ${left.padEnd(width)}${right}`);
}

function helpText<K extends string>(spec: CommandSpec<K>): string {
  const optionRows = [...Object.entries<OptionSpec>(spec.options), ...Object.entries(COMMON_OPTIONS)].map(([name, o]) => {
    const label = name === "help" ? "-h, --help" : optionLabel(name, o);
    const extra = [o.required ? "required" : "", o.defaultText ? `default ${o.defaultText}` : ""].filter(Boolean).join(", ");
    return [label, `${o.description}${extra ? ` (${extra})` : ""}`] as const;
  });
  return [
    `loopkeeper ${spec.name} — ${spec.summary}`,
    "",
    `Usage: ${usageLine(spec)}`,
    ...(spec.positionals ? ["", "Arguments:", ...table([[spec.positionals.name, spec.positionals.description]])] : []),
    "",
    "Options:",
    ...table(optionRows),
    ...(spec.notes ?? []).flatMap((n) => ["", n]),
    "",
    spec.examples.length > 1 ? "Examples:" : "Example:",
    ...spec.examples.map((e) => `  loopkeeper ${e}`),
    "",
    EXIT_CODES,
  ].join("\n");
}

/** `--ambient -10` reads as a value, not as an unknown option `-1`. */
function joinNegativeNumbers(argv: readonly string[], numeric: ReadonlySet<string>): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    const next = argv[i + 1];
    if (arg.startsWith("--") && numeric.has(arg.slice(2)) && next !== undefined && /^-\d|^-\.\d/.test(next)) {
      out.push(`${arg}=${next}`);
      i++;
    } else out.push(arg);
  }
  return out;
}

/** Node's parser messages mention quoting rules; ours say what to do for this command. */
function usageErrorFrom(e: unknown, spec: { name: string; optionNames: string[] }): UsageError {
  const code = (e as NodeJS.ErrnoException).code;
  const message = e instanceof Error ? e.message : String(e);
  const takes = `${spec.name} takes ${spec.optionNames.map((n) => `--${n}`).join(", ")}; see loopkeeper ${spec.name} --help.`;
  if (code === "ERR_PARSE_ARGS_UNKNOWN_OPTION") {
    const name = /'([^']+)'/.exec(message)?.[1] ?? "?";
    return new UsageError(`Unknown option ${name}. ${takes}`);
  }
  if (code === "ERR_PARSE_ARGS_INVALID_OPTION_VALUE") {
    const name = /'(--?[\w-]+)/.exec(message)?.[1] ?? "the option";
    if (/does not take an argument/.test(message)) return new UsageError(`${name} takes no value.`);
    return new UsageError(`${name} needs a value, e.g. ${name} <value>; a value starting with "-" is written ${name}=-value.`);
  }
  return new UsageError(`${message} ${takes}`);
}

/** True when argv asks for help (before a `--` that ends the options). */
export function wantsHelp(argv: readonly string[]): boolean {
  const end = argv.indexOf("--");
  return (end === -1 ? argv : argv.slice(0, end)).some((a) => a === "--help" || a === "-h");
}

/** True when argv asks for JSON output (before a `--` that ends the options). */
export function wantsJson(argv: readonly string[]): boolean {
  const end = argv.indexOf("--");
  return (end === -1 ? argv : argv.slice(0, end)).includes("--json");
}

/** Builds a command on node:util's parseArgs: strict options, checked positionals, generated help. */
export function defineCommand<K extends string>(spec: CommandSpec<K>): CliCommand {
  const all: Record<string, OptionSpec> = { ...spec.options, ...COMMON_OPTIONS };
  const optionNames = Object.keys(all);
  const numeric = new Set(optionNames.filter((n) => all[n]!.kind === "number" || all[n]!.kind === "integer"));
  const usage = usageLine(spec);
  const nodeOptions = Object.fromEntries(optionNames.map((n) => [n, n === "help" ? { type: "boolean" as const, short: "h" } : { type: all[n]!.kind === "flag" ? ("boolean" as const) : ("string" as const) }]));

  const parse = (argv: readonly string[]): CommandArgs<K> => {
    let parsed: { values: Record<string, string | boolean | undefined>; positionals: string[] };
    try {
      parsed = parseArgv({ args: joinNegativeNumbers(argv, numeric), options: nodeOptions, allowPositionals: true, strict: true });
    } catch (e) {
      throw usageErrorFrom(e, { name: spec.name, optionNames });
    }
    const { values, positionals } = parsed;
    const p = spec.positionals;
    if (!p && positionals.length > 0) throw new UsageError(`${spec.name} takes no file arguments (got "${positionals[0]}").`);
    if (p && (positionals.length < p.min || positionals.length > p.max)) {
      const want = p.min === p.max ? `exactly ${p.min}` : p.max === Infinity ? `at least ${p.min}` : `${p.min} to ${p.max}`;
      throw new UsageError(`${spec.name} takes ${want} ${p.name} argument${p.max === 1 ? "" : "s"}, got ${positionals.length}.`);
    }
    const missing = Object.entries<OptionSpec>(spec.options).filter(([n, o]) => o.required && values[n] === undefined);
    if (missing.length > 0) throw new UsageError(`${missing.map(([n]) => `--${n}`).join(" and ")} ${missing.length > 1 ? "are" : "is"} required.`);

    const text = (name: K): string | undefined => {
      const v = values[name];
      return typeof v === "string" ? v : undefined;
    };
    const number = (name: K): number | undefined => {
      const raw = text(name);
      if (raw === undefined) return undefined;
      const value = Number(raw);
      if (raw.trim() === "" || !Number.isFinite(value)) throw new UsageError(`--${name} must be a number, got "${raw}".`);
      return value;
    };
    return {
      positionals,
      text,
      number,
      integer(name, { min, max, what }) {
        const raw = text(name);
        if (raw === undefined) return undefined;
        const value = Number(raw);
        if (!/^\s*-?\d+\s*$/.test(raw) || value < min || value > max) throw new UsageError(`--${name} is ${what}: a whole number from ${min} to ${max}, got "${raw}".`);
        return value;
      },
      flag: (name) => values[name] === true,
    };
  };

  return { name: spec.name, summary: spec.summary, usage, help: helpText(spec), run: (argv) => spec.run(parse(argv)) };
}
