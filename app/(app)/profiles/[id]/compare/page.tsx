import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { getProfile } from "@/lib/api/operations/profiles";
import { profileDetail } from "@/lib/use-cases/profiles/read";
import { PageHeader } from "@/components/ui/panel";
import { CompareView } from "@/components/profiles/compare-view";

export const metadata: Metadata = { title: "Compare versions" };

export default async function ComparePage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor("read");
  const { id } = await params;
  const state = await prefetchScreen(actor, [screenQuery(getProfile, { params: { id } }, ({ params: parsed }) => profileDetail(getDb(), parsed))]);
  return (
    <>
      <PageHeader title="Compare versions" subtitle="Text differences side by side and both versions' curves on one plot." />
      <HydrationBoundary state={state}>
        <CompareView id={id} />
      </HydrationBoundary>
    </>
  );
}
