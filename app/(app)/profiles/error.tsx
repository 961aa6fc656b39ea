"use client";

import { SectionError } from "@/components/ui/section-error";

export default function ProfilesError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the profiles" error={error} retry={retry} />;
}
