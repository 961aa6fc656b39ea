import type { Metadata } from "next";
import Link from "next/link";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { PageHeader } from "@/components/ui/panel";
import { buttonClass } from "@/components/ui/button";
import { Pipeline } from "@/components/builds/pipeline";
import { HydrationBoundary } from "@tanstack/react-query";
import { getDb } from "@/db/client";
import { listBuilds } from "@/lib/api/operations/builds";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { listBuildsForPipeline } from "@/lib/use-cases/builds/list";
import { STAGE_ORDER } from "@/lib/release/stages";

export const metadata: Metadata = { title: "Builds" };

export default async function BuildsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor("read");
  const wanted = (await searchParams).stage;
  // A stage from the dashboard's tiles shows that column alone; anything else shows them all.
  const stage = STAGE_ORDER.find((s) => s === wanted);
  const state = await prefetchScreen(actor, [screenQuery(listBuilds, {}, ({ query }) => listBuildsForPipeline(getDb(), query))]);
  return (
    <>
      <PageHeader
        title="Builds"
        subtitle="Firmware and profile banks on their way to the factory, by stage."
        actions={can(actor.role, "build:create") ? <Link href="/builds/new" className={buttonClass("primary", "no-underline")}>New build</Link> : undefined}
      />
      <HydrationBoundary state={state}>
        <Pipeline stage={stage} />
      </HydrationBoundary>
    </>
  );
}
