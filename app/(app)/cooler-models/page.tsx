import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { PageHeader } from "@/components/ui/panel";
import { CoolerModelsList } from "@/components/registry/cooler-models-list";

export const metadata: Metadata = { title: "Cooler models" };

export default async function CoolerModelsPage() {
  const actor = await requirePageActor("read");
  return (
    <>
      <PageHeader title="Cooler models" subtitle="Products: radiator, fans, pump and the controller board they ship with." />
      <CoolerModelsList canWrite={can(actor.role, "registry:write")} />
    </>
  );
}
