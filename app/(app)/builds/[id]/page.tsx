import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { notFound } from "next/navigation";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { getBuild, getBuildGate } from "@/lib/api/operations/builds";
import { buildDetail } from "@/lib/use-cases/builds/detail";
import { buildGate } from "@/lib/use-cases/builds/gate";
import { BuildPage } from "@/components/builds/build-page";

export const metadata: Metadata = { title: "Build" };

const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function BuildDetailPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor("read");
  const { id } = await params;
  if (!UUID_RE.test(id)) notFound();
  const db = getDb();
  const state = await prefetchScreen(actor, [
    screenQuery(getBuild, { params: { id } }, ({ params: parsed }) => buildDetail(db, parsed)),
    // The next stage's checklist as this person sees it, so the actions render with the page.
    screenQuery(getBuildGate, { params: { id } }, ({ params: parsed }) => buildGate(db, parsed, { userId: actor.userId, role: actor.role })),
  ]);
  return (
    <HydrationBoundary state={state}>
      <BuildPage id={id} viewer={{ userId: actor.userId, role: actor.role }} />
    </HydrationBoundary>
  );
}
