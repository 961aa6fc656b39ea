import { writeIntelHex } from "../../lib/engine";
import { defineCommand } from "../args";
import { writeOutput as write, type CommandResult } from "../io";
import { encodeProfileFiles, profileFilesPositional, versionsOption } from "./encode-files";

/** `bank`: encode profiles into a bank image for the board revision, optionally as Intel HEX too. */
export const bankCommand = defineCommand({
  name: "bank",
  summary: "encode profiles, one per slot in the order given, into a bank image for the board revision of the hardware context.",
  positionals: profileFilesPositional,
  options: {
    hardware: { kind: "text", value: "hw.json", description: "hardware context whose board revision sets memory size, slot count and base address", required: true },
    out: { kind: "text", value: "bank.bin", description: "file the binary bank image is written to", required: true },
    hex: { kind: "text", value: "bank.hex", description: "also write the image as Intel HEX at the board's base address" },
    versions: versionsOption,
  },
  examples: ["bank examples/quiet.profile.json examples/performance.profile.json --hardware examples/cooler-360.hardware.json --out bank.bin --hex bank.hex --versions 1.0.0,2.3.1"],
  run: (args) => bank(args.positionals, { hwFile: args.text("hardware")!, out: args.text("out")!, hexFile: args.text("hex"), versionList: args.text("versions") }),
});

function bank(files: string[], { hwFile, out, hexFile, versionList }: { hwFile: string; out: string; hexFile: string | undefined; versionList: string | undefined }): CommandResult {
  const encoded = encodeProfileFiles(files, hwFile, versionList);
  if (!encoded.ok) return encoded.result;
  const { slots, board, bytes } = encoded.value;
  write(out, bytes);
  if (hexFile) write(hexFile, writeIntelHex(bytes, board.baseAddress));
  const crc = new DataView(bytes.buffer, bytes.byteOffset).getUint32(bytes.length - 4, true);
  const crcHex = `0x${crc.toString(16).toUpperCase().padStart(8, "0")}`;
  const slotInfo = slots.map((s, i) => ({ slot: i, file: s.file, version: s.version, contentHashPrefix: s.contentHashHex!.slice(0, 16) }));
  const human = [
    `Wrote ${out}: ${bytes.length} of ${board.memoryBytes} bytes (${((100 * bytes.length) / board.memoryBytes).toFixed(0)} %), ${slots.length} of ${board.slotCount} slots, CRC-32 ${crcHex}.`,
    ...(hexFile ? [`Wrote ${hexFile}: Intel HEX at base address 0x${board.baseAddress.toString(16).toUpperCase().padStart(8, "0")}.`] : []),
    ...slotInfo.map((s) => `  slot ${s.slot + 1}: ${s.file} v${s.version} hash ${s.contentHashPrefix}`),
  ].join("\n");
  return { exitCode: 0, human, json: { ok: true, out, hex: hexFile ?? null, byteLength: bytes.length, memoryBytes: board.memoryBytes, crc32: crcHex, slots: slotInfo } };
}
