import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { PageHeader } from "@/components/ui/panel";
import { ComponentsList } from "@/components/registry/components-list";

export const metadata: Metadata = { title: "Components" };

export default async function ComponentsPage() {
  const actor = await requirePageActor("read");
  return (
    <>
      <PageHeader title="Components" subtitle="Fan and pump models with the datasheet figures the curve engine uses." />
      <ComponentsList canWrite={can(actor.role, "registry:write")} />
    </>
  );
}
