/**
 * The signature block of a bank image (docs/bank-format.md, "Signature"):
 * the `.sig` sidecar file holds exactly these bytes, and a board with room
 * stores them right after the image's CRC-32.
 *
 *   0  4  magic "LKSG"
 *   4  1  block format version, 1
 *   5  8  key id: first 8 bytes of SHA-256 of the raw 32-byte Ed25519 public key
 *  13 64  Ed25519 signature (RFC 8032 §5.1.6) of the image, header to CRC inclusive
 */
export const SIGNATURE_MAGIC = new Uint8Array([0x4c, 0x4b, 0x53, 0x47]);
export const SIGNATURE_BLOCK_VERSION = 1;
export const KEY_ID_BYTES = 8;
export const ED25519_SIGNATURE_BYTES = 64;
export const SIGNATURE_BLOCK_BYTES = 4 + 1 + KEY_ID_BYTES + ED25519_SIGNATURE_BYTES;

const hex = (b: Uint8Array): string => Array.from(b, (x) => x.toString(16).padStart(2, "0")).join("");

export interface SignatureBlock {
  /** 16 lower-case hex digits. */
  keyId: string;
  signature: Uint8Array;
}

/** The block's bytes for a key id (16 hex digits) and a 64-byte signature. */
export function formatSignatureBlock(block: SignatureBlock): Uint8Array {
  if (!/^[0-9a-f]{16}$/.test(block.keyId) || block.signature.length !== ED25519_SIGNATURE_BYTES) throw new Error("a signature block needs a 16-hex-digit key id and a 64-byte signature");
  const out = new Uint8Array(SIGNATURE_BLOCK_BYTES);
  out.set(SIGNATURE_MAGIC, 0);
  out[4] = SIGNATURE_BLOCK_VERSION;
  for (let i = 0; i < KEY_ID_BYTES; i++) out[5 + i] = parseInt(block.keyId.slice(i * 2, i * 2 + 2), 16);
  out.set(block.signature, 5 + KEY_ID_BYTES);
  return out;
}

/** Reads a block at `offset`; a message says what is wrong when it is not one. */
export function parseSignatureBlock(bytes: Uint8Array, offset = 0): { ok: true; block: SignatureBlock } | { ok: false; message: string } {
  if (bytes.length - offset < SIGNATURE_BLOCK_BYTES) return { ok: false, message: `A signature block is ${SIGNATURE_BLOCK_BYTES} bytes; ${Math.max(0, bytes.length - offset)} are there.` };
  for (let i = 0; i < 4; i++) if (bytes[offset + i] !== SIGNATURE_MAGIC[i]) return { ok: false, message: 'The signature block does not start with "LKSG".' };
  if (bytes[offset + 4] !== SIGNATURE_BLOCK_VERSION) return { ok: false, message: `Signature block version ${bytes[offset + 4]} is not supported (this tool reads ${SIGNATURE_BLOCK_VERSION}).` };
  return { ok: true, block: { keyId: hex(bytes.subarray(offset + 5, offset + 5 + KEY_ID_BYTES)), signature: bytes.slice(offset + 5 + KEY_ID_BYTES, offset + SIGNATURE_BLOCK_BYTES) } };
}
