"use client";

import { SectionError } from "@/components/ui/section-error";

export default function BuildError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the build" error={error} retry={retry} />;
}
