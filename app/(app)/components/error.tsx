"use client";

import { SectionError } from "@/components/ui/section-error";

export default function ComponentsError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the fans and pumps" error={error} retry={retry} />;
}
