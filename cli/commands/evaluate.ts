import { COOLANTS, type Coolant, evaluateCurves, listenerDistanceProblem, loadSweep, operatingPoint } from "../../lib/engine";
import { defineCommand, UsageError } from "../args";
import { fmtDb, formatIssues, jsonSafe, type CommandResult } from "../io";
import { loadHardware, loadProfile } from "./load";

const DISCLAIMER = "Estimates from a lumped model; a release still needs lab measurement on real hardware.";

const DEFAULTS = { heatLoadW: 200, ambientC: 25, distanceM: 1, coolant: "water" } as const;

/** `evaluate`: speeds and noise against liquid temperature, and the operating point at a heat load. */
export const evaluateCommand = defineCommand({
  name: "evaluate",
  summary: "estimate pump and fan speeds and noise against liquid temperature, and the operating point at a heat load.",
  positionals: { name: "<profile.json>", description: "the profile document to evaluate", min: 1, max: 1 },
  options: {
    hardware: { kind: "text", value: "hw.json", description: "hardware context (board revision, pump, fans, radiator)", required: true },
    load: { kind: "number", value: "W", description: "heat load on the cold plate in watts", defaultText: `${DEFAULTS.heatLoadW}` },
    ambient: { kind: "number", value: "°C", description: "ambient air temperature", defaultText: `${DEFAULTS.ambientC}` },
    distance: { kind: "number", value: "m", description: "listener distance for the noise estimate; refused inside the cooler's near field (closer than about the radiator's largest dimension)", defaultText: `${DEFAULTS.distanceM}` },
    coolant: { kind: "text", value: Object.keys(COOLANTS).join("|"), description: "coolant in the loop", defaultText: DEFAULTS.coolant },
  },
  examples: ["evaluate examples/performance.profile.json --hardware examples/cooler-360.hardware.json --load 250 --ambient 30"],
  notes: [DISCLAIMER],
  run(args) {
    const coolantKey = args.text("coolant") ?? DEFAULTS.coolant;
    if (!(coolantKey in COOLANTS)) throw new UsageError(`--coolant must be one of ${Object.keys(COOLANTS).join(", ")}, got "${coolantKey}".`);
    return evaluate(args.positionals[0]!, args.text("hardware")!, {
      heatLoadW: args.number("load") ?? DEFAULTS.heatLoadW,
      ambientC: args.number("ambient") ?? DEFAULTS.ambientC,
      distanceM: args.number("distance") ?? DEFAULTS.distanceM,
      coolant: COOLANTS[coolantKey as keyof typeof COOLANTS],
    });
  },
});

function evaluate(file: string, hwFile: string, { heatLoadW, ambientC, distanceM, coolant }: { heatLoadW: number; ambientC: number; distanceM: number; coolant: Coolant }): CommandResult {
  const hw = loadHardware(hwFile);
  if (!hw.ok || !hw.value) return { exitCode: 1, human: formatIssues(hw.file, hw.issues), json: { ok: false, hardware: { file: hw.file, issues: hw.issues } } };
  const distanceProblem = listenerDistanceProblem(hw.value, distanceM);
  if (distanceProblem) throw new UsageError(`--distance: ${distanceProblem}`);
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
    `Operating point at ${heatLoadW} W heat load, ${ambientC} °C ambient air, coolant ${coolant.name} (properties at ${coolant.propertiesAtTempC} °C):`,
    `  liquid ${op.liquidTempC.toFixed(2)} °C${op.holdsBelowCritical ? "" : `  ← at or above the critical ${profile.value.criticalTempC} °C: this curve cannot hold the load`}${op.onFanStopStep ? "  (fans cycle around their stop temperature)" : ""}`,
    `  pump ${op.pump.rpm.toFixed(0)} RPM, ${op.pumpFlowLpm.toFixed(2)} L/min, coolant rise across the cold plate ${op.coolantRiseK.toFixed(2)} K`,
    `  fans ${op.fans.stopped ? "stopped" : `${op.fans.rpm.toFixed(0)} RPM`}, noise ${fmtDb(op.noise.totalDbA1m)} at 1 m${distanceM === 1 ? "" : `, ${fmtDb(op.noise.totalDbAAtDistance)} at ${distanceM} m`}`,
  );
  const failing = sweep.find((p) => !p.holdsBelowCritical);
  lines.push(failing ? `Load sweep 50–350 W: above the critical temperature from ${failing.heatLoadW} W.` : "Load sweep 50–350 W: stays below the critical temperature.");
  lines.push("", DISCLAIMER);
  return { exitCode: 0, human: lines.join("\n"), json: jsonSafe({ ok: true, file, warnings: profile.issues, curve: rows, operatingPoint: op, sweep, note: DISCLAIMER }) };
}
