"use client";

import { SectionError } from "@/components/ui/section-error";

export default function ProfileError({ error, retry }: { error: Error & { digest?: string }; retry: () => void }) {
  return <SectionError what="the profile" error={error} retry={retry} />;
}
