"use client";

import { SectionError } from "@/components/ui/section-error";

export default function LookupError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the serial lookup" error={error} retry={retry} />;
}
