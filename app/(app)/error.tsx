"use client";

import { SectionError } from "@/components/ui/section-error";

export default function DashboardError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the dashboard" error={error} retry={retry} />;
}
