import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { can } from "@/lib/auth/roles";
import { PageHeader } from "@/components/ui/panel";
import { ProfilesList } from "@/components/profiles/profiles-list";

export const metadata: Metadata = { title: "Profiles" };

export default async function ProfilesPage() {
  const actor = await requirePageActor("read");
  return (
    <>
      <PageHeader title="Profiles" subtitle="Pump and fan curve sets per cooler model, with their published versions." />
      <ProfilesList canWrite={can(actor.role, "registry:write")} />
    </>
  );
}
