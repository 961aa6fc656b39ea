import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { getProfile } from "@/lib/api/operations/profiles";
import { profileDetail } from "@/lib/use-cases/profiles/read";
import { startingBoardRange } from "@/lib/registry/range-fit";
import { rangeAdmission } from "@/lib/registry/range-match";
import { PageHeader } from "@/components/ui/panel";
import { ProfileWorkspace } from "@/components/profiles/editor/workspace";

export const metadata: Metadata = { title: "Profile editor" };

export default async function ProfileEditorPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor("read");
  const { id } = await params;
  const canWrite = can(actor.role, "registry:write");
  const loaded: { detail?: Awaited<ReturnType<typeof profileDetail>> } = {};
  const state = await prefetchScreen(actor, [screenQuery(getProfile, { params: { id } }, async ({ params: parsed }) => (loaded.detail = await profileDetail(getDb(), parsed)))]);
  // The range the memory gauge opens with (the latest version's, or the first version's default),
  // judged here: the browser loads semver's range matching only when someone types another range.
  const { detail } = loaded;
  const knownRanges = detail ? [rangeAdmission(startingBoardRange(detail.versions[0]?.boardRange), detail.revisions)] : [];
  return (
    <>
      {canWrite ? (
        <PageHeader title="Profile editor" subtitle="Edit the JSON; problems, plots and memory update as you type. Drafts save themselves." />
      ) : (
        <PageHeader title="Profile" subtitle="The working draft with its problems, plots and memory for the chosen hardware. Your role may read it, not change it." />
      )}
      <HydrationBoundary state={state}>
        <ProfileWorkspace id={id} canWrite={canWrite} knownRanges={knownRanges} />
      </HydrationBoundary>
    </>
  );
}
