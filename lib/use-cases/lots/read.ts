import "server-only";
import type { z } from "zod";
import type { Executor } from "@/db/client";
import { listBoardModels } from "@/db/boards";
import { listBuildsAtStages, listLots } from "@/db/lots";
import type { lotsQuery } from "@/lib/api/operations/support";
import { LOT_STAGES } from "@/lib/release/stages";
import { toLotView } from "./lot-view";

/** One page of production lots; one row more is read to know whether another page follows. Read by the API and the lots page. */
export async function lotsPage(db: Executor, query: z.output<typeof lotsQuery>) {
  const rows = await listLots(db, {
    boardModelId: query.board,
    buildId: query.build,
    lotCode: query.code,
    sort: query.sort,
    dir: query.dir,
    limit: query.pageSize + 1,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.slice(0, query.pageSize).map(toLotView), page: query.page, pageSize: query.pageSize, hasMore: rows.length > query.pageSize };
}

/**
 * What the lot forms offer: every board model (the one board-model list, revisions in semver
 * order) with the builds a lot may name, and withdrawn ones so filters still find their lots.
 */
export async function lotFormOptions(db: Executor) {
  const [models, builds] = await Promise.all([listBoardModels(db), listBuildsAtStages(db, { stages: [...LOT_STAGES, "withdrawn"] })]);
  return {
    boardModels: models.map((m) => ({
      id: m.id,
      name: m.name,
      serialPrefix: m.serialPrefix,
      revisions: m.revisions.map((r) => r.revision),
      builds: builds.filter((b) => b.boardModelId === m.id).map(({ boardModelId: _m, ...b }) => b),
    })),
  };
}
