import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { PageHeader } from "@/components/ui/panel";
import { BoardsView } from "@/components/registry/boards-view";

export const metadata: Metadata = { title: "Boards" };

export default async function BoardsPage() {
  const actor = await requirePageActor("read");
  return (
    <>
      <PageHeader title="Boards" subtitle="Controller board models and their hardware revisions: memory, slots and point limits." />
      <BoardsView canWrite={can(actor.role, "registry:write")} />
    </>
  );
}
