import type { Metadata } from "next";
import { Suspense } from "react";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { PageHeader } from "@/components/ui/panel";
import { WithdrawnBuilds } from "@/components/support/withdrawn-builds";

export const metadata: Metadata = { title: "Withdrawn builds" };

export default async function WithdrawnPage() {
  await requirePageActor("support", "/support/withdrawn");
  return (
    <>
      <PageHeader title="Withdrawn builds" subtitle="How many boards shipped with each withdrawn build, in which lots; export the list for a recall." />
      <Suspense>
        <WithdrawnBuilds />
      </Suspense>
    </>
  );
}
