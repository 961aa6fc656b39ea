import { createHash, createPrivateKey, createPublicKey, generateKeyPairSync, sign, verify, type KeyObject } from "node:crypto";
import { KEY_ID_BYTES } from "./signature-block";

/*
 * Ed25519 (RFC 8032) through node:crypto. Server and command line only: the
 * browser never signs or verifies. Private keys stay KeyObjects and are never
 * turned back into text here, so nothing can log or export them by accident.
 */

/** The raw 32-byte public key (RFC 8032 §5.1.5) of a public or private Ed25519 key. */
export function rawPublicKey(key: KeyObject): Uint8Array {
  const pub = key.type === "private" ? createPublicKey(key) : key;
  const jwk = pub.export({ format: "jwk" });
  if (jwk.crv !== "Ed25519" || typeof jwk.x !== "string") throw new Error("not an Ed25519 key");
  return new Uint8Array(Buffer.from(jwk.x, "base64url"));
}

/** Key id: the first 8 bytes of SHA-256 of the raw public key, 16 lower-case hex digits. */
export function keyIdOf(key: KeyObject): string {
  return createHash("sha256").update(rawPublicKey(key)).digest("hex").slice(0, KEY_ID_BYTES * 2);
}

/** An Ed25519 private key from its 32-byte seed (RFC 8032 "secret key"), via the PKCS #8 wrapping of RFC 8410. */
export function privateKeyFromSeed(seed: Uint8Array): KeyObject {
  if (seed.length !== 32) throw new Error("an Ed25519 secret key is 32 bytes");
  const prefix = Buffer.from("302e020100300506032b657004220420", "hex");
  return createPrivateKey({ key: Buffer.concat([prefix, seed]), format: "der", type: "pkcs8" });
}

/** An Ed25519 public key from its raw 32 bytes, via the SubjectPublicKeyInfo wrapping of RFC 8410. */
export function publicKeyFromRaw(raw: Uint8Array): KeyObject {
  if (raw.length !== 32) throw new Error("an Ed25519 public key is 32 bytes");
  return createPublicKey({ key: Buffer.concat([Buffer.from("302a300506032b6570032100", "hex"), raw]), format: "der", type: "spki" });
}

/** Reads an Ed25519 public key from PEM (SubjectPublicKeyInfo); throws a plain message otherwise. */
export function publicKeyFromPem(pem: string): KeyObject {
  let key: KeyObject;
  try {
    key = createPublicKey(pem);
  } catch {
    throw new Error("not a PEM public key (-----BEGIN PUBLIC KEY-----)");
  }
  if (key.asymmetricKeyType !== "ed25519") throw new Error(`the public key is ${key.asymmetricKeyType ?? "unknown"}, not Ed25519`);
  return key;
}

export const publicKeyPem = (key: KeyObject): string => (key.type === "private" ? createPublicKey(key) : key).export({ format: "pem", type: "spki" }).toString();

/** A new Ed25519 key pair. */
export const generateSigningKey = (): KeyObject => generateKeyPairSync("ed25519").privateKey;

/** Ed25519 signature (64 bytes) of `message`. */
export const signEd25519 = (privateKey: KeyObject, message: Uint8Array): Uint8Array => new Uint8Array(sign(null, message, privateKey));

/** True when `signature` is `publicKey`'s Ed25519 signature of `message`. */
export function verifyEd25519(publicKey: KeyObject, message: Uint8Array, signature: Uint8Array): boolean {
  try {
    return verify(null, message, publicKey, signature);
  } catch {
    return false;
  }
}

/** Verification by a PEM public key, as reportDump takes it; a key that is not Ed25519 verifies nothing. */
export function verifyWithPem(publicKeyPem: string, message: Uint8Array, signature: Uint8Array): boolean {
  try {
    return verifyEd25519(publicKeyFromPem(publicKeyPem), message, signature);
  } catch {
    return false;
  }
}
