"use client";

import { SectionError } from "@/components/ui/section-error";

export default function AccountError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="your account" error={error} retry={retry} />;
}
