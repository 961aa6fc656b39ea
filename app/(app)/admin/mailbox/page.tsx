import type { Metadata } from "next";
import { Suspense } from "react";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { PageHeader } from "@/components/ui/panel";
import { Mailbox } from "@/components/admin/mailbox";

export const metadata: Metadata = { title: "Mailbox" };

export default async function MailboxPage() {
  await requirePageActor("admin");
  return (
    <>
      <PageHeader title="Mailbox" subtitle="Messages the local SMTP stand-in received. In production, mail goes to the real relay instead." />
      <Suspense>
        <Mailbox />
      </Suspense>
    </>
  );
}
