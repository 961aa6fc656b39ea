import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { queryFromUrl } from "@/lib/api/client";
import { componentsQuery, listComponents } from "@/lib/api/operations/registry";
import { listQueryFromUrl, searchParamsOf } from "@/lib/api/list-query";
import { COMPONENT_FILTERS } from "@/lib/api/screen-queries";
import { componentsPage } from "@/lib/use-cases/registry/read";
import { PageHeader } from "@/components/ui/panel";
import { ComponentsList } from "@/components/registry/components-list";

export const metadata: Metadata = { title: "Components" };

export default async function ComponentsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor("read");
  const query = queryFromUrl(componentsQuery, listQueryFromUrl(COMPONENT_FILTERS, searchParamsOf(await searchParams)));
  const state = await prefetchScreen(actor, [screenQuery(listComponents, { query }, ({ query: parsed }) => componentsPage(getDb(), parsed))]);
  return (
    <>
      <PageHeader title="Components" subtitle="Fan and pump models with the datasheet figures the curve engine uses." />
      <HydrationBoundary state={state}>
        <ComponentsList canWrite={can(actor.role, "registry:write")} query={query} />
      </HydrationBoundary>
    </>
  );
}
