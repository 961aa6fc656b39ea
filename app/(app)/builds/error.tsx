"use client";

import { SectionError } from "@/components/ui/section-error";

export default function BuildsError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the builds" error={error} retry={retry} />;
}
