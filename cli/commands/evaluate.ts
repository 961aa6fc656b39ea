import { COOLANTS, evaluateCurves, loadSweep, operatingPoint } from "../../lib/engine";
import { numberOption, parseArgs, UsageError } from "../args";
import { fmtDb, formatIssues, jsonSafe, type CommandResult } from "../io";
import { loadHardware, loadProfile } from "./load";

export const EVALUATE_USAGE = "evaluate <profile.json> --hardware hw.json [--load W] [--ambient C] [--distance m] [--coolant water|pg30] [--json]";

const DISCLAIMER = "Estimates from a lumped model; a release still needs lab measurement on real hardware.";

/** `evaluate`: speeds and noise against liquid temperature, and the operating point at a heat load. */
export function evaluateCommand(argv: readonly string[]): CommandResult {
  const args = parseArgs(argv, ["hardware", "load", "ambient", "distance", "coolant"], ["json"]);
  if (args.positionals.length !== 1) throw new UsageError(`Give one profile file: ${EVALUATE_USAGE}`);
  const hwFile = args.options.get("hardware");
  if (!hwFile) throw new UsageError(`--hardware is required: ${EVALUATE_USAGE}`);
  const heatLoadW = numberOption(args, "load", 200)!;
  const ambientC = numberOption(args, "ambient", 25)!;
  const distanceM = numberOption(args, "distance", 1)!;
  const coolantKey = args.options.get("coolant") ?? "water";
  if (!(coolantKey in COOLANTS)) throw new UsageError(`--coolant must be one of ${Object.keys(COOLANTS).join(", ")}.`);
  const coolant = COOLANTS[coolantKey as keyof typeof COOLANTS];

  const file = args.positionals[0]!;
  const hw = loadHardware(hwFile);
  if (!hw.ok || !hw.value) return { exitCode: 1, human: formatIssues(hw.file, hw.issues), json: { ok: false, hardware: { file: hw.file, issues: hw.issues } } };
  const profile = loadProfile(file, hw.value);
  if (!profile.ok || !profile.value) return { exitCode: 1, human: formatIssues(file, profile.issues), json: { ok: false, file, issues: profile.issues } };

  const rows = evaluateCurves(profile.value, hw.value, { distanceM });
  const op = operatingPoint(profile.value, hw.value, { heatLoadW, ambientC, distanceM, coolant });
  const sweep = loadSweep(profile.value, hw.value, { ambientC, distanceM, coolant });

  const lines = [`${profile.value.name} on ${hw.value.name ?? hwFile} (board ${hw.value.boardRevision.version})`, "", " °C  pump %   pump RPM  fan %   fan RPM   noise @1 m"];
  for (const r of rows.filter((row) => row.tempC % 5 === 0)) {
    lines.push(`${r.tempC.toFixed(0).padStart(3)}  ${r.pumpDutyPct.toFixed(1).padStart(6)}  ${r.pumpRpm.toFixed(0).padStart(9)}  ${r.fanDutyPct.toFixed(1).padStart(5)}  ${r.fansStopped ? "  stopped" : r.fanRpm.toFixed(0).padStart(9)}   ${fmtDb(r.soundDbA1m)}`);
  }
  lines.push(
    "",
    `Operating point at ${heatLoadW} W, ${ambientC} °C ambient, ${coolant.name}:`,
    `  liquid ${op.liquidTempC.toFixed(2)} °C${op.holdsBelowCritical ? "" : `  ← at or above the critical ${profile.value.criticalTempC} °C: this curve cannot hold the load`}${op.onFanStopStep ? "  (fans cycle around their stop temperature)" : ""}`,
    `  pump ${op.pump.rpm.toFixed(0)} RPM, ${op.pumpFlowLpm.toFixed(2)} L/min, coolant rise across the cold plate ${op.coolantRiseK.toFixed(2)} K`,
    `  fans ${op.fans.stopped ? "stopped" : `${op.fans.rpm.toFixed(0)} RPM`}, noise ${fmtDb(op.noise.totalDbA1m)} at 1 m, ${fmtDb(op.noise.totalDbAAtDistance)} at ${distanceM} m`,
  );
  const failing = sweep.find((p) => !p.holdsBelowCritical);
  lines.push(failing ? `Load sweep 50–350 W: above the critical temperature from ${failing.heatLoadW} W.` : "Load sweep 50–350 W: stays below the critical temperature.");
  lines.push("", DISCLAIMER);
  return { exitCode: 0, human: lines.join("\n"), json: jsonSafe({ ok: true, file, warnings: profile.issues, curve: rows, operatingPoint: op, sweep, note: DISCLAIMER }) };
}
