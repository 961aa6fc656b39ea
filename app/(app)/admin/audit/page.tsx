import type { Metadata } from "next";
import { Suspense } from "react";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { PageHeader } from "@/components/ui/panel";
import { AuditLog } from "@/components/admin/audit-log";

export const metadata: Metadata = { title: "Audit log" };

export default async function AuditPage() {
  await requirePageActor("admin");
  return (
    <>
      <PageHeader title="Audit log" subtitle="Every change of state: who, what, when, before and after." />
      <Suspense>
        <AuditLog />
      </Suspense>
    </>
  );
}
