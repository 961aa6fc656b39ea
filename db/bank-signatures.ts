import "server-only";
import { and, asc, eq, isNull, ne } from "drizzle-orm";
import { bankSigningKeys, boardModels, builds, type Build } from "./schema";
import type { Executor, Tx } from "./client";
import { bankSigner } from "@/lib/platform/signing-key";

/**
 * Signs a build's bank with the registry's Ed25519 key and keeps the signature
 * and key id with the build; registers the key as the board model's current
 * one (closing the validity of a rotated-out key, which stays listed so older
 * images still verify). Runs inside the pilot transition's transaction.
 */
export async function signBuildBank(tx: Tx, build: Pick<Build, "id" | "boardModelId" | "bankImage">): Promise<void> {
  if (!build.bankImage) return;
  const fields = await bankSignatureFields(tx, { boardModelId: build.boardModelId, bankImage: build.bankImage });
  await tx.update(builds).set(fields).where(eq(builds.id, build.id));
}

/**
 * The signature columns for a bank about to be stored, registering the signing key as the
 * board model's current one. Used where a build row is written already past pilot (the demo
 * seed), since the database refuses changes to a withdrawn build after its insert.
 */
export async function bankSignatureFields(tx: Tx, build: { boardModelId: string; bankImage: Uint8Array }): Promise<Pick<Build, "bankSignature" | "bankSignatureKeyId">> {
  const signer = bankSigner();
  const now = new Date();
  const [known] = await tx.select().from(bankSigningKeys).where(and(eq(bankSigningKeys.boardModelId, build.boardModelId), eq(bankSigningKeys.keyId, signer.keyId)));
  if (!known) {
    await tx.update(bankSigningKeys).set({ validUntil: now }).where(and(eq(bankSigningKeys.boardModelId, build.boardModelId), isNull(bankSigningKeys.validUntil), ne(bankSigningKeys.keyId, signer.keyId)));
    await tx.insert(bankSigningKeys).values({ boardModelId: build.boardModelId, keyId: signer.keyId, publicKeyPem: signer.publicKeyPem, validFrom: now });
  }
  return { bankSignature: Buffer.from(signer.sign(new Uint8Array(build.bankImage))), bankSignatureKeyId: signer.keyId };
}

/** A board model's bank signing public keys with their validity, oldest first. */
export async function listBankSigningKeys(db: Executor, { boardModelId }: { boardModelId: string }) {
  return db
    .select({ keyId: bankSigningKeys.keyId, publicKeyPem: bankSigningKeys.publicKeyPem, validFrom: bankSigningKeys.validFrom, validUntil: bankSigningKeys.validUntil })
    .from(bankSigningKeys)
    .where(eq(bankSigningKeys.boardModelId, boardModelId))
    .orderBy(asc(bankSigningKeys.validFrom));
}

/** Every bank signing public key the registry lists, with its board model: what a dump's signature is checked against. */
export async function listAllBankSigningKeys(db: Executor): Promise<{ keyId: string; publicKeyPem: string; boardModelName: string }[]> {
  return db
    .select({ keyId: bankSigningKeys.keyId, publicKeyPem: bankSigningKeys.publicKeyPem, boardModelName: boardModels.name })
    .from(bankSigningKeys)
    .innerJoin(boardModels, eq(boardModels.id, bankSigningKeys.boardModelId))
    .orderBy(asc(bankSigningKeys.validFrom));
}
