import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { getBoardRevision } from "@/lib/api/operations/registry";
import { boardRevisionDetail } from "@/lib/use-cases/registry/read";
import { PageHeader } from "@/components/ui/panel";
import { BoardRevisionView } from "@/components/registry/board-revision-view";

export const metadata: Metadata = { title: "Board revision" };

export default async function BoardRevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor("read");
  const { id } = await params;
  const state = await prefetchScreen(actor, [screenQuery(getBoardRevision, { params: { id } }, ({ params: parsed }) => boardRevisionDetail(getDb(), parsed))]);
  return (
    <>
      <PageHeader title="Board revision" subtitle="Its limits, the profile versions that run on it, and the whole board's compatibility matrix." />
      <HydrationBoundary state={state}>
        <BoardRevisionView id={id} canWrite={can(actor.role, "registry:write")} />
      </HydrationBoundary>
    </>
  );
}
