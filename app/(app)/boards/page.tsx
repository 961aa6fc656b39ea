import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { listBoardModels } from "@/lib/api/operations/registry";
import { boardModelsWithRevisions } from "@/lib/use-cases/registry/read";
import { PageHeader } from "@/components/ui/panel";
import { BoardsView } from "@/components/registry/boards-view";

export const metadata: Metadata = { title: "Boards" };

export default async function BoardsPage() {
  const actor = await requirePageActor("read");
  const state = await prefetchScreen(actor, [screenQuery(listBoardModels, {}, () => boardModelsWithRevisions(getDb()))]);
  return (
    <>
      <PageHeader title="Boards" subtitle="Controller board models and their hardware revisions: memory, slots and point limits." />
      <HydrationBoundary state={state}>
        <BoardsView canWrite={can(actor.role, "registry:write")} />
      </HydrationBoundary>
    </>
  );
}
