import "server-only";
import type { Executor } from "@/db/client";
import { listBuildsByBankSha256, listRegistryVersionsByHashPrefix } from "@/db/dumps";
import { dumpKeys, looksLikeIntelHex, readIntelHex, reportDump, type DumpReport } from "@/lib/engine";

/**
 * Identifies a dump against the registry: looks up the published versions its
 * slots' content labels name and the build whose bank has the image's SHA-256,
 * then reports with the same pure function the command line uses.
 */
export async function identifyDumpBytes(db: Executor, input: { bytes: Uint8Array; fileName: string | null }): Promise<DumpReport> {
  let image = input.bytes;
  if (looksLikeIntelHex(image)) image = readIntelHex(new TextDecoder().decode(image)).bytes;
  const keys = dumpKeys(image);
  const [known, builds] = await Promise.all([
    listRegistryVersionsByHashPrefix(db, { prefixes: keys.hashPrefixes }),
    keys.imageSha256 ? listBuildsByBankSha256(db, { sha256: keys.imageSha256 }) : Promise.resolve([]),
  ]);
  return reportDump({ bytes: input.bytes, fileName: input.fileName, known, builds });
}
