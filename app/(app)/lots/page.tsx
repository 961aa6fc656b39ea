import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { Suspense } from "react";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { can } from "@/lib/auth/roles";
import { getDb } from "@/db/client";
import { searchParamsOf } from "@/lib/api/list-query";
import { queryFromUrl } from "@/lib/api/client";
import { getLotOptions, listLots, lotsQuery } from "@/lib/api/operations/support";
import { LOT_FILTERS, pagedQueryFromUrl } from "@/lib/api/screen-queries";
import { lotFormOptions, lotsPage } from "@/lib/use-cases/lots/read";
import { PageHeader } from "@/components/ui/panel";
import { LotsPage } from "@/components/support/lots-page";

export const metadata: Metadata = { title: "Production lots" };

export default async function ProductionLotsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor("read", "/lots");
  const db = getDb();
  const query = queryFromUrl(lotsQuery, pagedQueryFromUrl(LOT_FILTERS, searchParamsOf(await searchParams)));
  const state = await prefetchScreen(actor, [
    screenQuery(listLots, { query }, ({ query: parsed }) => lotsPage(db, parsed)),
    screenQuery(getLotOptions, {}, () => lotFormOptions(db)),
  ]);
  return (
    <>
      <PageHeader title="Production lots" subtitle="Boards produced with one build: serial ranges, board revision, date and line." />
      <Suspense>
        <HydrationBoundary state={state}>
          <LotsPage canWrite={can(actor.role, "lot:write")} query={query} />
        </HydrationBoundary>
      </Suspense>
    </>
  );
}
