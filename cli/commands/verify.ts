import { decodeBank, looksLikeIntelHex, readIntelHex } from "../../lib/engine";
import { keyIdOf, publicKeyFromPem, verifyEd25519 } from "../../lib/signing/ed25519";
import { parseSignatureBlock } from "../../lib/signing/signature-block";
import { defineCommand, UsageError } from "../args";
import { readBytes, readText, type CommandResult } from "../io";

/** `verify`: checks offline that a bank image was signed by the registry's key for its board model. */
export const verifyCommand = defineCommand({
  name: "verify",
  summary: "check a bank image's Ed25519 signature (the .sig sidecar) with the board model's public key, offline.",
  positionals: { name: "<image.bin|image.hex>", description: "the bank image, as downloaded from the build or read back from a board", min: 1, max: 1 },
  options: {
    signature: { kind: "text", value: "image.sig", description: "the 77-byte signature block downloaded with the build (docs/bank-format.md)", required: true },
    "public-key": { kind: "text", value: "key.pem", description: "the board model's public key (PEM) listed for the key id in the block", required: true },
  },
  examples: ["verify bank-3.1.0.bin --signature bank-3.1.0.sig --public-key tc1-key.pem"],
  notes: ["Exit 0 when the signature is valid for this image and key; 1 when it is not (or the image is damaged)."],
  run: (args) => verify(args.positionals[0]!, args.text("signature")!, args.text("public-key")!),
});

function verify(file: string, sigFile: string, keyFile: string): CommandResult {
  let bytes = readBytes(file);
  if (/\.(hex|ihx)$/i.test(file) || looksLikeIntelHex(bytes)) {
    const hex = readIntelHex(new TextDecoder().decode(bytes));
    if (!hex.ok) return { exitCode: 1, human: hex.errors.map((e) => `${file}:${e.line}: error ${e.code}: ${e.message}`).join("\n"), json: { ok: false, file, errors: hex.errors } };
    bytes = hex.bytes;
  }
  const decoded = decodeBank(bytes);
  const fail = (message: string): CommandResult => ({ exitCode: 1, human: `${file}: NOT VERIFIED: ${message}`, json: { ok: false, file, message } });
  if (!decoded.ok || decoded.byteLength === undefined) return fail(`the image is not a sound bank (${decoded.errors[0]?.message ?? "unreadable"}).`);
  const image = bytes.subarray(0, decoded.byteLength);
  const block = parseSignatureBlock(readBytes(sigFile));
  if (!block.ok) return fail(`${sigFile}: ${block.message}`);
  let key;
  try {
    key = publicKeyFromPem(readText(keyFile));
  } catch (e) {
    throw new UsageError(`${keyFile}: ${e instanceof Error ? e.message : "unreadable"}.`);
  }
  const keyId = keyIdOf(key);
  if (keyId !== block.block.keyId) return fail(`the signature names key ${block.block.keyId}, but ${keyFile} is key ${keyId}; use the board model's key with that id.`);
  if (!verifyEd25519(key, image, block.block.signature)) return fail(`the signature of key ${keyId} does not match this image: it was changed after signing, or signed elsewhere.`);
  return { exitCode: 0, human: `${file}: signed by key ${keyId}: valid (${image.length}-byte bank).`, json: { ok: true, file, keyId, bankBytes: image.length } };
}
