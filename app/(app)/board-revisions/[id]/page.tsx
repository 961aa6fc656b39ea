import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { PageHeader } from "@/components/ui/panel";
import { BoardRevisionView } from "@/components/registry/board-revision-view";

export const metadata: Metadata = { title: "Board revision" };

export default async function BoardRevisionPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor("read");
  const { id } = await params;
  return (
    <>
      <PageHeader title="Board revision" subtitle="Its limits, the profile versions that run on it, and the whole board's compatibility matrix." />
      <BoardRevisionView id={id} canWrite={can(actor.role, "registry:write")} />
    </>
  );
}
