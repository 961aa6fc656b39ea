import { parseSignatureBlock, type SignatureBlock } from "../signing/signature-block";

/** A public key the signature may be checked with (the registry lists them per board model). */
export interface SigningKeyRef {
  /** 16 lower-case hex digits (docs/bank-format.md, "Signature block"). */
  keyId: string;
  publicKeyPem: string;
  boardModelName?: string;
}

/** Ed25519 verification, given by the caller: node:crypto on the server and the command line. */
export type VerifySignature = (publicKeyPem: string, message: Uint8Array, signature: Uint8Array) => boolean;

/** Where the signature that was checked came from. */
export type SignatureSource = "sidecar" | "stored" | "build";

/**
 * valid: the signature of the named key matches the image.
 * invalid: it does not, the block is damaged, or the key is not one the registry lists.
 * unverified: a signature is there but no public key was given to check it with.
 * unsigned: no signature was given, none is stored after the CRC and the image is no signed build's bank.
 */
export interface DumpSignature {
  status: "valid" | "invalid" | "unverified" | "unsigned";
  keyId?: string;
  source?: SignatureSource;
  /** "signed by key K: valid", "signed by key K: invalid", "signed by key K: not checked", or "unsigned". */
  summary: string;
  /** Why, and what to do. */
  message: string;
}

export interface SignatureInput {
  /** The image, header to CRC inclusive; undefined when it could not be read. */
  image: Uint8Array | undefined;
  /** A `.sig` sidecar supplied with the dump. */
  sidecar?: Uint8Array;
  /** The block a board with room stores right after the CRC. */
  stored?: SignatureBlock;
  /** The signature the registry keeps with the build whose bank this image is. */
  build?: SignatureBlock & { version: string };
  keys: readonly SigningKeyRef[];
  verify: VerifySignature;
}

const SOURCE_TEXT: Record<SignatureSource, string> = {
  sidecar: "the .sig file given",
  stored: "the signature block stored after the CRC",
  build: "the signature the registry keeps with the build",
};

/**
 * Checks a dump's Ed25519 signature (docs/bank-format.md, "Signature"): a supplied
 * `.sig` first, else the block stored after the CRC, else the signature of the build
 * whose bank the image is. The key is found by the block's key id among `keys`.
 */
export function judgeSignature(input: SignatureInput): DumpSignature {
  let block: SignatureBlock | undefined;
  let source: SignatureSource | undefined;
  if (input.sidecar) {
    const parsed = parseSignatureBlock(input.sidecar);
    if (!parsed.ok) return { status: "invalid", source: "sidecar", summary: "signature: invalid", message: `The .sig file is not a signature block: ${parsed.message}` };
    block = parsed.block;
    source = "sidecar";
  } else if (input.stored) {
    block = input.stored;
    source = "stored";
  } else if (input.build) {
    block = input.build;
    source = "build";
  }
  if (!block || !source) {
    return { status: "unsigned", summary: "unsigned", message: "No signature: none was supplied, none is stored after the CRC, and the image is not the bank of a signed build (banks are signed when a build enters pilot)." };
  }
  const keyId = block.keyId;
  const from = SOURCE_TEXT[source];
  const From = from.charAt(0).toUpperCase() + from.slice(1);
  if (!input.image) return { status: "invalid", keyId, source, summary: `signed by key ${keyId}: invalid`, message: `The image cannot be read, so ${from} cannot match it.` };
  const key = input.keys.find((k) => k.keyId === keyId);
  if (!key) {
    if (input.keys.length === 0) return { status: "unverified", keyId, source, summary: `signed by key ${keyId}: not checked`, message: `${From} names key ${keyId}; give that board model's public key to check it.` };
    return { status: "invalid", keyId, source, summary: `signed by key ${keyId}: invalid`, message: `${From} names key ${keyId}, which is none of the public keys it was checked against (${input.keys.map((k) => k.keyId).join(", ")}): it was not signed by a key trusted here.` };
  }
  const ok = input.verify(key.publicKeyPem, input.image, block.signature);
  const owner = key.boardModelName ? ` (${key.boardModelName})` : "";
  if (ok) return { status: "valid", keyId, source, summary: `signed by key ${keyId}: valid`, message: `${From} is key ${keyId}${owner}'s Ed25519 signature of exactly these bytes.` };
  return { status: "invalid", keyId, source, summary: `signed by key ${keyId}: invalid`, message: `${From} does not match this image for key ${keyId}${owner}: the bytes were changed after signing, or it was signed for another image.` };
}
