import type { Metadata } from "next";
import { Suspense } from "react";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { PageHeader } from "@/components/ui/panel";
import { LotsPage } from "@/components/support/lots-page";

export const metadata: Metadata = { title: "Production lots" };

export default async function ProductionLotsPage() {
  const actor = await requirePageActor("read", "/lots");
  return (
    <>
      <PageHeader title="Production lots" subtitle="Boards produced with one build: serial ranges, board revision, date and line." />
      <Suspense>
        <LotsPage canWrite={can(actor.role, "lot:write")} />
      </Suspense>
    </>
  );
}
