"use client";

import { SectionError } from "@/components/ui/section-error";

export default function CoolerModelsError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the cooler models" error={error} retry={retry} />;
}
