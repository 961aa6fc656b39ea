import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { getDb } from "@/db/client";
import { listQueryFromUrl, searchParamsOf } from "@/lib/api/list-query";
import { queryFromUrl } from "@/lib/api/client";
import { listProfiles, profilesQuery } from "@/lib/api/operations/profiles";
import { ALL_COOLERS, listCoolerModels } from "@/lib/api/operations/registry";
import { PROFILE_FILTERS } from "@/lib/api/screen-queries";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { profilesPage } from "@/lib/use-cases/profiles/read";
import { coolerModelsPage } from "@/lib/use-cases/registry/read";
import { PageHeader } from "@/components/ui/panel";
import { ProfilesList } from "@/components/profiles/profiles-list";

export const metadata: Metadata = { title: "Profiles" };

export default async function ProfilesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor("read");
  const db = getDb();
  const query = queryFromUrl(profilesQuery, listQueryFromUrl(PROFILE_FILTERS, searchParamsOf(await searchParams)));
  const state = await prefetchScreen(actor, [
    screenQuery(listProfiles, { query }, ({ query: parsed }) => profilesPage(db, parsed)),
    screenQuery(listCoolerModels, { query: ALL_COOLERS }, ({ query }) => coolerModelsPage(db, query)),
  ]);
  return (
    <>
      <PageHeader title="Profiles" subtitle="Pump and fan curve sets per cooler model, with their published versions." />
      <HydrationBoundary state={state}>
        <ProfilesList canWrite={can(actor.role, "registry:write")} query={query} />
      </HydrationBoundary>
    </>
  );
}
