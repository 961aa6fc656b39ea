import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { PageHeader } from "@/components/ui/panel";
import { CompareView } from "@/components/profiles/compare-view";

export const metadata: Metadata = { title: "Compare versions" };

export default async function ComparePage({ params }: { params: Promise<{ id: string }> }) {
  await requirePageActor("read");
  const { id } = await params;
  return (
    <>
      <PageHeader title="Compare versions" subtitle="Text differences side by side and both versions' curves on one plot." />
      <CompareView id={id} />
    </>
  );
}
