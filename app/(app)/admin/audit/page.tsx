import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { Suspense } from "react";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { queryFromUrl } from "@/lib/api/client";
import { auditQuery, listAudit } from "@/lib/api/operations/admin";
import { searchParamsOf } from "@/lib/api/list-query";
import { AUDIT_FILTERS, pagedQueryFromUrl } from "@/lib/api/screen-queries";
import { auditPage } from "@/lib/use-cases/admin/read";
import { PageHeader } from "@/components/ui/panel";
import { AuditLog } from "@/components/admin/audit-log";

export const metadata: Metadata = { title: "Audit log" };

export default async function AuditPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePageActor("admin");
  const query = queryFromUrl(auditQuery, pagedQueryFromUrl(AUDIT_FILTERS, searchParamsOf(await searchParams)));
  const state = await prefetchScreen(actor, [screenQuery(listAudit, { query }, ({ query: parsed }) => auditPage(getDb(), parsed))]);
  return (
    <>
      <PageHeader title="Audit log" subtitle="Every change of state: who, what, when, before and after." />
      <Suspense>
        <HydrationBoundary state={state}>
          <AuditLog query={query} />
        </HydrationBoundary>
      </Suspense>
    </>
  );
}
