import "server-only";
import { createPrivateKey, type KeyObject } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { bankSigningKeyEnv } from "./env";
import { generateSigningKey, keyIdOf, publicKeyPem, signEd25519 } from "@/lib/signing/ed25519";

/** Signs bank images; holds the private key as a KeyObject only, never as text. */
export interface BankSigner {
  keyId: string;
  publicKeyPem: string;
  sign(image: Uint8Array): Uint8Array;
}

/** Where the demo key lives: under the ignored data folder, beside the generated session secret. */
const demoKeyFile = (): string => path.resolve(process.env.LOOPKEEPER_DATA_DIR ?? ".data", "bank-signing-key.pem");

function loadKey(): KeyObject {
  const parsed = bankSigningKeyEnv.safeParse(process.env.BANK_SIGNING_KEY);
  // The message names the variable, never its value.
  if (!parsed.success) throw new Error(parsed.error.issues[0]?.message ?? "BANK_SIGNING_KEY is invalid");
  if (parsed.data) return createPrivateKey(parsed.data);
  if (process.env.NODE_ENV === "production") throw new Error("BANK_SIGNING_KEY is not set: production signs bank images with a key from the environment, never a generated one.");
  const file = demoKeyFile();
  if (!fs.existsSync(file)) {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    const pem = generateSigningKey().export({ format: "pem", type: "pkcs8" }).toString();
    // wx: two processes starting at once must not overwrite each other's key.
    try {
      fs.writeFileSync(file, pem, { mode: 0o600, flag: "wx" });
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== "EEXIST") throw e;
    }
  }
  return createPrivateKey(fs.readFileSync(file, "utf8"));
}

let cached: BankSigner | undefined;

/** The bank signer, loaded once: BANK_SIGNING_KEY, or the demo key file generated on first use outside production. */
export function bankSigner(): BankSigner {
  if (!cached) {
    const key = loadKey();
    cached = { keyId: keyIdOf(key), publicKeyPem: publicKeyPem(key), sign: (image) => signEd25519(key, image) };
  }
  return cached;
}
