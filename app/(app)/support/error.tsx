"use client";

import { SectionError } from "@/components/ui/section-error";

export default function SupportError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the support page" error={error} retry={retry} />;
}
