import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { PageHeader } from "@/components/ui/panel";
import { AccessAdmin } from "@/components/admin/access-admin";

export const metadata: Metadata = { title: "Sign-ins and tokens" };

export default async function AccessPage() {
  await requirePageActor("admin");
  return (
    <>
      <PageHeader title="Sign-ins and tokens" subtitle="Accounts slowed down by failed sign-ins, and every live API token, with the means to unlock and revoke." />
      <AccessAdmin />
    </>
  );
}
