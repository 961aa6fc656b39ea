"use client";

import { SectionError } from "@/components/ui/section-error";

export default function AdminError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the administration page" error={error} retry={retry} />;
}
