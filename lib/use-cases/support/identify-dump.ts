import "server-only";
import type { Executor } from "@/db/client";
import { listAllBankSigningKeys } from "@/db/bank-signatures";
import { listBuildsByBankSha256, listRegistryVersionsByHashPrefix } from "@/db/dumps";
import { dumpKeys, looksLikeIntelHex, readIntelHex, reportDump, type DumpReport } from "@/lib/engine";
import { verifyWithPem } from "@/lib/signing/ed25519";

/**
 * Identifies a dump against the registry: looks up the published versions its
 * slots' content labels name and the build whose bank has the image's SHA-256,
 * then reports with the same pure function the command line uses. The signature (a
 * supplied .sig, else the block stored after the CRC, else the matching build's) is
 * checked against every key the registry lists.
 */
export async function identifyDumpBytes(db: Executor, input: { bytes: Uint8Array; fileName: string | null; signature?: Uint8Array }): Promise<DumpReport> {
  let image = input.bytes;
  if (looksLikeIntelHex(image)) image = readIntelHex(new TextDecoder().decode(image)).bytes;
  const keys = dumpKeys(image);
  const [known, builds, signingKeys] = await Promise.all([
    listRegistryVersionsByHashPrefix(db, { prefixes: keys.hashPrefixes }),
    keys.imageSha256 ? listBuildsByBankSha256(db, { sha256: keys.imageSha256 }) : Promise.resolve([]),
    listAllBankSigningKeys(db),
  ]);
  return reportDump({ bytes: input.bytes, fileName: input.fileName, known, builds, signature: { sidecar: input.signature, keys: signingKeys, verify: verifyWithPem } });
}
