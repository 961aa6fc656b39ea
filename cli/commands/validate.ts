import { defineCommand } from "../args";
import { formatIssues } from "../io";
import { loadHardware, loadProfile } from "./load";

/** `validate`: schema and semantic rules of a profile, with board limits when --hardware is given. */
export const validateCommand = defineCommand({
  name: "validate",
  summary: "check a profile against the schema and the curve rules, and against a board's limits when --hardware is given.",
  positionals: { name: "<profile.json>", description: "the profile document to check", min: 1, max: 1 },
  options: {
    hardware: { kind: "text", value: "hw.json", description: "hardware context (board revision, pump, fans) whose limits the profile must keep" },
  },
  examples: ["validate examples/quiet.profile.json --hardware examples/cooler-360.hardware.json"],
  notes: ["Problems are printed as file:line:column: severity code (JSON pointer): message."],
  run(args) {
    const file = args.positionals[0]!;
    const hwFile = args.text("hardware");
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
  },
});
