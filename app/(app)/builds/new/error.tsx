"use client";

import { SectionError } from "@/components/ui/section-error";

export default function NewBuildError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the new-build form" error={error} retry={retry} />;
}
