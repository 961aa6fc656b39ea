import { decodeBank, looksLikeIntelHex, readIntelHex, reportDump, type DumpReport, type RegistryBuild, type RegistryVersion, type SigningKeyRef } from "../../lib/engine";
import { keyIdOf, publicKeyFromPem, publicKeyPem, verifyWithPem } from "../../lib/signing/ed25519";
import { defineCommand, UsageError } from "../args";
import { readBytes, readText, type CommandResult } from "../io";

const KNOWN_SHAPE = `{ "profileVersions": [{ "profileVersionId", "version", "contentHash", "document" }, …], "builds": [{ "buildId", "version", "stage", "bankSha256", "bankSignatureKeyId"?, "bankSignatureHex"? }, …], "signingKeys"?: [{ "keyId", "publicKeyPem" }, …] }`;

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);
const strings = (v: Record<string, unknown>, fields: readonly string[]): boolean => fields.every((f) => typeof v[f] === "string");

/** The registry's published versions (with their stored documents) and builds (with their bank SHA-256), as exported for offline use. */
function loadKnown(file: string): { known: RegistryVersion[]; builds: RegistryBuild[]; signingKeys: SigningKeyRef[] } {
  let parsed: unknown;
  try {
    parsed = JSON.parse(readText(file));
  } catch {
    throw new UsageError(`${file}: not JSON; expected ${KNOWN_SHAPE}.`);
  }
  const versions: unknown = Array.isArray(parsed) ? parsed : isRecord(parsed) ? parsed.profileVersions : undefined;
  const builds: unknown = isRecord(parsed) ? (parsed.builds ?? []) : [];
  const versionsOk = Array.isArray(versions) && versions.every((k) => isRecord(k) && strings(k, ["profileVersionId", "version", "contentHash"]) && isRecord(k.document));
  const buildsOk = Array.isArray(builds) && builds.every((b) => isRecord(b) && strings(b, ["buildId", "version", "stage", "bankSha256"]));
  if (!versionsOk || !buildsOk) {
    throw new UsageError(`${file}: expected ${KNOWN_SHAPE}; each profile version needs its stored document, because a slot is "exact" only when its bytes equal that document's encoding.`);
  }
  const keys: unknown = isRecord(parsed) ? (parsed.signingKeys ?? []) : [];
  if (!Array.isArray(keys) || !keys.every((k) => isRecord(k) && strings(k, ["keyId", "publicKeyPem"]))) throw new UsageError(`${file}: signingKeys must be [{ "keyId", "publicKeyPem" }, …].`);
  const withSignatures = (builds as (RegistryBuild & { bankSignatureKeyId?: unknown; bankSignatureHex?: unknown })[]).map(({ bankSignatureKeyId, bankSignatureHex, ...b }) =>
    typeof bankSignatureKeyId === "string" && typeof bankSignatureHex === "string" && /^[0-9a-f]{128}$/i.test(bankSignatureHex)
      ? { ...b, bankSignature: { keyId: bankSignatureKeyId, signature: new Uint8Array(Buffer.from(bankSignatureHex, "hex")) } }
      : b,
  );
  return { known: versions as RegistryVersion[], builds: withSignatures, signingKeys: keys as SigningKeyRef[] };
}

/** The board model's public key given on the command line, under its key id. */
function loadPublicKey(file: string): SigningKeyRef {
  try {
    const key = publicKeyFromPem(readText(file));
    return { keyId: keyIdOf(key), publicKeyPem: publicKeyPem(key) };
  } catch (e) {
    if (e instanceof UsageError) throw e;
    throw new UsageError(`${file}: ${e instanceof Error ? e.message : "unreadable"}.`);
  }
}

const MATCH_TEXT = { exact: "exact", altered: "ALTERED", unknown: "unknown to the registry", undecodable: "UNDECODABLE" } as const;

function describe(file: string, r: DumpReport, withKnown: boolean): string[] {
  const lines: string[] = [];
  if (r.hex) {
    lines.push(`${file}: Intel HEX, ${r.hex.recordCount} records${r.hex.startAddress !== undefined ? `, data from 0x${r.hex.startAddress.toString(16).toUpperCase().padStart(8, "0")}` : ""}.`);
    for (const s of r.hex.startRecords) lines.push(`${file}:${s.line}: start-address record (type 0${s.type}): execution starts at ${s.address}; it places no data.`);
  }
  if (r.slotCount !== undefined) lines.push(`Bank, ${r.slotCount} slots${r.imageSha256 ? `, SHA-256 ${r.imageSha256}` : ""}.`);
  if (r.crc) lines.push(`CRC-32 stored ${r.crc.stored}, computed ${r.crc.computed}: ${r.crc.ok ? "match" : "MISMATCH"}.`);
  if (r.signature) lines.push(`Signature: ${r.signature.summary}. ${r.signature.message}`);
  if (r.build) lines.push(`This is the bank of build ${r.build.version}${r.build.boardModelName ? ` (${r.build.boardModelName})` : ""}, stage ${r.build.stage}.`);
  else if (withKnown && r.imageSha256) lines.push("No build in the registry has this exact bank.");
  for (const s of r.slots) {
    if (s.match === "undecodable") {
      lines.push(`  slot ${s.slotIndex + 1} @ byte ${s.offset}: UNDECODABLE: ${s.reason ?? ""}`);
      continue;
    }
    const who = !withKnown ? "" : s.profileVersionId ? `: ${MATCH_TEXT[s.match]} ${s.coolerName ? `${s.coolerName} · ` : ""}${s.profileName ?? s.profileVersionId} v${s.knownVersion}` : `: ${MATCH_TEXT[s.match]}`;
    lines.push(`  slot ${s.slotIndex + 1}: v${s.version} label ${s.contentHashPrefix}${who}`);
    for (const d of s.differences) lines.push(`    differs: ${d}`);
    for (const f of s.findings) lines.push(`    ${f.severity === "error" ? "FAULT" : "warning"} ${f.code}: ${f.message}`);
  }
  return lines;
}

/**
 * `inspect`: decode a bank image or memory dump (.bin or Intel HEX), check it, and with
 * `--known` identify every slot by content, as the support page and the API do.
 */
export const inspectCommand = defineCommand({
  name: "inspect",
  summary: "decode a bank image or memory dump (.bin or Intel HEX), check it strictly, run the safety rules on every slot and, with --known, identify each slot by content.",
  positionals: { name: "<dump.bin|dump.hex>", description: "bank image or memory dump; Intel HEX when named .hex/.ihx or starting with ':'", min: 1, max: 1 },
  options: {
    known: { kind: "text", value: "registry.json", description: `the registry's versions and builds to identify by: ${KNOWN_SHAPE}` },
    signature: { kind: "text", value: "image.sig", description: "the image's signature block (.sig) to check; without it the block stored after the CRC, or the matching build's signature, is checked" },
    "public-key": { kind: "text", value: "key.pem", description: "a board model's public key (PEM) to check the signature with" },
  },
  examples: ["inspect bank.hex", "inspect returned-board.bin --known registry.json --json", "inspect bank-3.1.0.bin --signature bank-3.1.0.sig --public-key tc1-key.pem"],
  notes: ["A slot is exact only when its bytes equal the registry's encoding of the version it names; otherwise altered (with the differing fields), unknown or undecodable. The signature line says: signed by key K: valid, invalid or not checked; or unsigned. Exit 1 when the image is damaged, a slot is altered or undecodable, a slot breaks a safety rule, or the signature is invalid."],
  run: (args) => inspect(args.positionals[0]!, args.text("known"), args.text("signature"), args.text("public-key")),
});

function inspect(file: string, knownFile: string | undefined, sigFile: string | undefined, keyFile: string | undefined): CommandResult {
  const { signingKeys, ...registry } = knownFile ? loadKnown(knownFile) : { known: [], builds: [], signingKeys: [] };
  const keys = [...(keyFile ? [loadPublicKey(keyFile)] : []), ...signingKeys];
  const sidecar = sigFile ? readBytes(sigFile) : undefined;
  const bytes = readBytes(file);
  const asHex = /\.(hex|ihx)$/i.test(file) || looksLikeIntelHex(bytes);
  if (asHex && !looksLikeIntelHex(bytes)) {
    return { exitCode: 1, human: `${file}:1: error hex.no_start_code: the file is named as Intel HEX but does not start with a ":" record.`, json: { ok: false, file } };
  }
  const report = reportDump({ bytes, fileName: file, ...registry, signature: { sidecar, keys, verify: verifyWithPem } });
  if (report.hex && !report.hex.ok) {
    const hex = readIntelHex(new TextDecoder().decode(bytes));
    return { exitCode: 1, human: hex.errors.map((e) => `${file}:${e.line}: error ${e.code}: ${e.message}`).join("\n"), json: { ok: false, file, hexErrors: hex.errors, report } };
  }
  const decoded = decodeBank(report.hex ? readIntelHex(new TextDecoder().decode(bytes)).bytes : bytes);
  const lines = describe(file, report, knownFile !== undefined);
  for (const e of decoded.errors) lines.push(`${file}${e.offset !== undefined ? ` @ byte ${e.offset}` : ""}: error ${e.code}: ${e.message}`);
  for (const f of report.faults) lines.push(`FAULT: ${f}`);
  const ok = report.status === "ok" && report.faults.length === 0;
  return { exitCode: ok ? 0 : 1, human: lines.join("\n"), json: { ...decoded, file, report } };
}
