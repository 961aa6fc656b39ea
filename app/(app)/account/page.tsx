import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ChangePasswordForm } from "@/components/account/change-password-form";
import { TokenManager } from "@/components/account/token-manager";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const actor = await requirePageActor("read");
  return (
    <>
      <PageHeader title="Your account" subtitle={`${actor.email} · ${ROLE_LABELS[actor.role]}`} />
      <div className="grid gap-5 xl:grid-cols-2">
        <Panel title="Change password">
          <ChangePasswordForm email={actor.email} name={actor.name} />
        </Panel>
        {/* Seven columns, three of them times with their zone: the whole width keeps the table from scrolling sideways. */}
        <Panel title="API tokens" className="xl:col-span-2">
          <TokenManager />
        </Panel>
      </div>
    </>
  );
}
