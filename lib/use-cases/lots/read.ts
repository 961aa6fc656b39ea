import "server-only";
import type { z } from "zod";
import type { Executor } from "@/db/client";
import { listLots, lotOptions } from "@/db/lots";
import type { lotsQuery } from "@/lib/api/operations/support";
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

/** What the lot forms offer: board models with their revisions and their pilot or production builds. */
export async function lotFormOptions(db: Executor) {
  return { boardModels: await lotOptions(db) };
}
