import "server-only";
import type { z } from "zod";
import type { Executor } from "@/db/client";
import * as boards from "@/db/boards";
import { listComponents } from "@/db/components";
import { listCoolerModels } from "@/db/cooler-models";
import { listVersionsForBoardModel } from "@/db/profile-versions";
import { listBankSigningKeys } from "@/db/bank-signatures";
import { AppError } from "@/lib/api/errors";
import type { componentsQuery, coolerModelsQuery } from "@/lib/api/operations/registry";
import { compatibilityCells } from "@/lib/registry/version-image";

// The registry's reads, each called by its API route and by the page that shows it first.

/** One page of fans and pumps. */
export function componentsPage(db: Executor, query: z.output<typeof componentsQuery>) {
  return listComponents(db, query);
}

/** One page of cooler models with their parts and profile counts. */
export function coolerModelsPage(db: Executor, query: z.output<typeof coolerModelsQuery>) {
  return listCoolerModels(db, query);
}

/** Every board model with its revisions. */
export async function boardModelsWithRevisions(db: Executor) {
  return { items: await boards.listBoardModels(db) };
}

/** A board revision's limits and which published profile versions fit it and its siblings. */
export async function boardRevisionDetail(db: Executor, { id }: { id: string }) {
  const found = await boards.getBoardRevision(db, { id });
  if (!found) throw new AppError("not_found", "No such board revision.");
  const siblings = (await boards.listRevisionsOfModel(db, { boardModelId: found.revision.boardModelId })).map((r) => ({ id: r.id, revision: r.revision, memoryBytes: r.memoryBytes, maxPointsPerCurve: r.maxPointsPerCurve }));
  const versions = await listVersionsForBoardModel(db, { boardModelId: found.revision.boardModelId });
  return {
    ...found,
    compatibility: { revisions: siblings, rows: versions.map((v) => ({ ...v, cells: compatibilityCells(v, siblings) })) },
  };
}

/** The public keys a board model's banks are signed with, with their validity: what a factory verifies a signature against. */
export async function boardSigningKeys(db: Executor, { boardModelId }: { boardModelId: string }) {
  const keys = await listBankSigningKeys(db, { boardModelId });
  return { keys: keys.map((k) => ({ keyId: k.keyId, publicKeyPem: k.publicKeyPem, validFrom: k.validFrom.toISOString(), validUntil: k.validUntil?.toISOString() ?? null })) };
}
