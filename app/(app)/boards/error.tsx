"use client";

import { SectionError } from "@/components/ui/section-error";

export default function BoardsError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the boards" error={error} retry={retry} />;
}
