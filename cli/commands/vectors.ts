import { bankVectors, vectorsJson } from "../../lib/firmware";
import { defineCommand } from "../args";
import { writeOutput, type CommandResult } from "../io";
import { encodeProfileFiles, profileFilesPositional, versionsOption } from "./encode-files";

/** `vectors`: firmware test vectors for the bank the profiles encode to. */
export const vectorsCommand = defineCommand({
  name: "vectors",
  summary: "write firmware test vectors (stored codes, duty over a temperature sweep, per-tick transient traces) for the bank these profiles encode to.",
  positionals: profileFilesPositional,
  options: {
    hardware: { kind: "text", value: "hw.json", description: "hardware context whose limits the profiles are checked against and whose board revision they must fit", required: true },
    out: { kind: "text", value: "vectors.json", description: "file the vectors are written to", required: true },
    versions: versionsOption,
  },
  examples: ["vectors examples/quiet.profile.json examples/performance.profile.json --hardware examples/cooler-360.hardware.json --out vectors.json"],
  notes: [
    "Every expected value is an integer code: temperatures in 0.5 °C (readings in 0.1 °C), duties in 0.5 %, one control tick per second. docs/firmware-vectors.md spells out the arithmetic; `loopkeeper header` writes a C reference that reproduces every value.",
  ],
  run: (args) => vectors(args.positionals, args.text("hardware")!, args.text("out")!, args.text("versions")),
});

function vectors(files: string[], hwFile: string, out: string, versionList: string | undefined): CommandResult {
  const encoded = encodeProfileFiles(files, hwFile, versionList);
  if (!encoded.ok) return encoded.result;
  const result = bankVectors(encoded.value.bytes);
  if (!result.ok) return { exitCode: 1, human: result.errors.map((e) => `error ${e.code}: ${e.message}`).join("\n"), json: { ok: false, errors: result.errors } };
  const v = result.vectors;
  writeOutput(out, vectorsJson(v));
  const ticks = v.slots.reduce((sum, s) => sum + s.traces.reduce((n, t) => n + t.tempDeciC.length, 0), 0);
  const human = [
    `Wrote ${out}: ${v.slots.length} slot${v.slots.length === 1 ? "" : "s"}, bank of ${v.bank.byteLength} bytes (CRC-32 0x${v.bank.crc32.toString(16).toUpperCase().padStart(8, "0")}), ${ticks} trace ticks.`,
    ...v.slots.map((s, i) => `  slot ${s.index + 1}: ${encoded.value.slots[i]?.file ?? "?"} v${s.version}, ${s.sweep.tempCode.length}-step sweep, traces: ${s.traces.map((t) => t.name).join(", ")}`),
  ].join("\n");
  return { exitCode: 0, human, json: { ok: true, out, byteLength: v.bank.byteLength, crc32: v.bank.crc32, slots: v.slots.length, traceTicks: ticks } };
}
