import { parseArgs, UsageError } from "../args";
import { formatIssues, type CommandResult } from "../io";
import { loadHardware, loadProfile } from "./load";

export const VALIDATE_USAGE = "validate <profile.json> [--hardware hw.json] [--json]";

/** `validate`: schema and semantic rules of a profile, with board limits when --hardware is given. */
export function validateCommand(argv: readonly string[]): CommandResult {
  const args = parseArgs(argv, ["hardware"], ["json"]);
  if (args.positionals.length !== 1) throw new UsageError(`Give one profile file: ${VALIDATE_USAGE}`);
  const file = args.positionals[0]!;
  const hwFile = args.options.get("hardware");
  const hw = hwFile ? loadHardware(hwFile) : undefined;
  if (hw && !hw.ok) {
    return {
      exitCode: 1,
      human: `${formatIssues(hw.file, hw.issues)}\n${hw.file}: hardware context is invalid; fix it first.`,
      json: { ok: false, file, hardware: { file: hw.file, ok: false, issues: hw.issues }, issues: [] },
    };
  }
  const profile = loadProfile(file, hw?.value);
  const errors = profile.issues.filter((i) => i.severity === "error").length;
  const warnings = profile.issues.length - errors;
  const summary = profile.ok ? `${file}: valid${warnings ? ` (${warnings} warning${warnings > 1 ? "s" : ""})` : ""}.` : `${file}: ${errors} error${errors > 1 ? "s" : ""}, ${warnings} warning${warnings === 1 ? "" : "s"}.`;
  const listed = formatIssues(file, profile.issues);
  return {
    exitCode: profile.ok ? 0 : 1,
    human: listed ? `${listed}\n${summary}` : summary,
    json: { ok: profile.ok, file, ...(hw ? { hardware: { file: hw.file, ok: true, issues: hw.issues } } : {}), issues: profile.issues },
  };
}
