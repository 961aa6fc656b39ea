import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { queryFromUrl } from "@/lib/api/client";
import { ALL_COMPONENTS, coolerModelsQuery, listBoardModels, listComponents, listCoolerModels } from "@/lib/api/operations/registry";
import { listQueryFromUrl, searchParamsOf } from "@/lib/api/list-query";
import { COOLER_FILTERS } from "@/lib/api/screen-queries";
import { boardModelsWithRevisions, componentsPage, coolerModelsPage } from "@/lib/use-cases/registry/read";
import { PageHeader } from "@/components/ui/panel";
import { CoolerModelsList } from "@/components/registry/cooler-models-list";

export const metadata: Metadata = { title: "Cooler models" };

export default async function CoolerModelsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor("read");
  const db = getDb();
  const query = queryFromUrl(coolerModelsQuery, listQueryFromUrl(COOLER_FILTERS, searchParamsOf(await searchParams)));
  const canWrite = can(actor.role, "registry:write");
  const state = await prefetchScreen(actor, [
    screenQuery(listCoolerModels, { query }, ({ query: parsed }) => coolerModelsPage(db, parsed)),
    // What the add form offers: writers only.
    ...(canWrite
      ? [screenQuery(listComponents, { query: ALL_COMPONENTS }, ({ query: parsed }) => componentsPage(db, parsed)), screenQuery(listBoardModels, {}, () => boardModelsWithRevisions(db))]
      : []),
  ]);
  return (
    <>
      <PageHeader title="Cooler models" subtitle="Products: radiator, fans, pump and the controller board they ship with." />
      <HydrationBoundary state={state}>
        <CoolerModelsList canWrite={canWrite} query={query} />
      </HydrationBoundary>
    </>
  );
}
