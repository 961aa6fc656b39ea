import { contentHashHex, encodeBank, type BankSlotInput, type BoardRevision } from "../../lib/engine";
import { UsageError } from "../args";
import { formatIssues, readText, type CommandResult } from "../io";
import { loadHardware, loadProfile } from "./load";

/** The profile list both bank-writing commands (`bank`, `vectors`) take, slot 1 first. */
export const profileFilesPositional = { name: "<profile.json>...", description: "profile documents, slot 1 first", min: 1, max: Infinity } as const;

/** The `--versions` option both bank-writing commands take. */
export const versionsOption = { kind: "text", value: "v1,v2,…", description: "one semver version per profile, comma-separated, in order", defaultText: "1.0.0 for each" } as const;

/** Profile files encoded into one bank for the hardware context's board revision. */
export interface EncodedFiles {
  bytes: Uint8Array;
  slots: (BankSlotInput & { file: string })[];
  board: BoardRevision;
}

/**
 * Validates the hardware context and each profile against it, then encodes the
 * profiles, one slot each in the order given, for the board revision (memory size
 * and slot count). A failed step comes back as the command's exit-1 result.
 */
export function encodeProfileFiles(files: readonly string[], hwFile: string, versionList: string | undefined): { ok: true; value: EncodedFiles } | { ok: false; result: CommandResult } {
  const versions = versionList?.split(",") ?? files.map(() => "1.0.0");
  if (versions.length !== files.length) throw new UsageError(`--versions lists ${versions.length} versions for ${files.length} profiles; give one per profile, in order.`);

  const hw = loadHardware(hwFile);
  if (!hw.ok || !hw.value) return { ok: false, result: { exitCode: 1, human: formatIssues(hw.file, hw.issues), json: { ok: false, hardware: { file: hw.file, issues: hw.issues } } } };
  const loaded = files.map((f) => loadProfile(f, hw.value));
  const bad = loaded.filter((l) => !l.ok);
  if (bad.length > 0) {
    return {
      ok: false,
      result: {
        exitCode: 1,
        human: bad.map((l) => formatIssues(l.file, l.issues.filter((i) => i.severity === "error"))).join("\n"),
        json: { ok: false, profiles: bad.map((l) => ({ file: l.file, issues: l.issues })) },
      },
    };
  }
  const slots = loaded.map((l, i) => ({ file: l.file, profile: l.value!, version: versions[i]!.trim(), contentHashHex: contentHashHex(JSON.parse(readText(l.file))) }));
  const board = hw.value.boardRevision;
  const encoded = encodeBank(slots, { memoryBytes: board.memoryBytes, slotCount: board.slotCount });
  if (!encoded.ok) return { ok: false, result: { exitCode: 1, human: encoded.errors.map((e) => `error ${e.code}: ${e.message}`).join("\n"), json: { ok: false, errors: encoded.errors } } };
  return { ok: true, value: { bytes: encoded.bytes, slots, board } };
}
