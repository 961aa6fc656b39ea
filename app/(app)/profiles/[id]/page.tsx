import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { PageHeader } from "@/components/ui/panel";
import { ProfileWorkspace } from "@/components/profiles/editor/workspace";

export const metadata: Metadata = { title: "Profile editor" };

export default async function ProfileEditorPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor("read");
  const { id } = await params;
  return (
    <>
      <PageHeader title="Profile editor" subtitle="Edit the JSON; problems, plots and memory update as you type. Drafts save themselves." />
      <ProfileWorkspace id={id} canWrite={can(actor.role, "registry:write")} />
    </>
  );
}
