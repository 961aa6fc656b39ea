"use client";

import { SectionError } from "@/components/ui/section-error";

export default function LotsError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the production lots" error={error} retry={retry} />;
}
