import "server-only";
import type { Executor } from "@/db/client";
import { findLotKeys } from "@/db/lots";
import type { LotInput } from "@/lib/lots/input";
import { BAD_SERIALS, lotSerials, resolveLotKeys, type LotFieldIssue, type ResolvedLot } from "@/lib/lots/rules";

/**
 * Looks up a lot's natural keys (serial prefix → board model, revision, build version) and
 * judges them with the lot rules. With `lockBuild` the build row stays share-locked until the
 * transaction ends, so it cannot be withdrawn between this check and the insert.
 */
export async function resolveLot(tx: Executor, lot: LotInput, { lockBuild }: { lockBuild: boolean }): Promise<{ resolved?: ResolvedLot; issues: LotFieldIssue[] }> {
  const serials = lotSerials(lot);
  if (!serials) return { issues: [BAD_SERIALS] };
  const keys = await findLotKeys(tx, { serialPrefix: serials.from.prefix, revision: lot.boardRevision, buildVersion: lot.buildVersion, lockBuild });
  return resolveLotKeys(lot, serials, keys);
}
