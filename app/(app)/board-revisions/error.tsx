"use client";

import { SectionError } from "@/components/ui/section-error";

export default function BoardRevisionError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the board revision" error={error} retry={retry} />;
}
