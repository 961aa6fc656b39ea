/** Command-line arguments: positionals, `--name value` options and boolean flags. */
export interface ParsedArgs {
  positionals: string[];
  options: Map<string, string>;
  flags: Set<string>;
}

/** Thrown for a mistake in how the command was called (exit code 2). */
export class UsageError extends Error {}

/**
 * Splits argv. `booleanFlags` take no value; every other `--name` takes the
 * next argument (or `--name=value`). Unknown names are usage errors.
 */
export function parseArgs(argv: readonly string[], valueOptions: readonly string[], booleanFlags: readonly string[]): ParsedArgs {
  const positionals: string[] = [];
  const options = new Map<string, string>();
  const flags = new Set<string>();
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (!arg.startsWith("--") || arg === "--") {
      if (arg !== "--") positionals.push(arg);
      continue;
    }
    const eq = arg.indexOf("=");
    const name = arg.slice(2, eq === -1 ? undefined : eq);
    if (booleanFlags.includes(name)) {
      if (eq !== -1) throw new UsageError(`--${name} takes no value.`);
      flags.add(name);
    } else if (valueOptions.includes(name)) {
      const value = eq !== -1 ? arg.slice(eq + 1) : argv[++i];
      if (value === undefined || (eq === -1 && value.startsWith("--"))) throw new UsageError(`--${name} needs a value.`);
      options.set(name, value);
    } else {
      throw new UsageError(`Unknown option --${name}.`);
    }
  }
  return { positionals, options, flags };
}

/** A numeric option, or the default; usage error when it is not a finite number. */
export function numberOption(args: ParsedArgs, name: string, fallback?: number): number | undefined {
  const raw = args.options.get(name);
  if (raw === undefined) return fallback;
  const value = Number(raw);
  if (raw.trim() === "" || !Number.isFinite(value)) throw new UsageError(`--${name} must be a number, got "${raw}".`);
  return value;
}
