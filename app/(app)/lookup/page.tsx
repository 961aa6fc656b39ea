import type { Metadata } from "next";
import { Suspense } from "react";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { PageHeader } from "@/components/ui/panel";
import { LookupView } from "@/components/support/lookup-view";

export const metadata: Metadata = { title: "Serial lookup" };

export default async function LookupPage() {
  await requirePageActor("support", "/lookup");
  return (
    <>
      <PageHeader title="Serial lookup" subtitle="Which build and which curves shipped on a board, what has changed since, and whether its build was withdrawn." />
      <Suspense>
        <LookupView />
      </Suspense>
    </>
  );
}
