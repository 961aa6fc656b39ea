import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { BuildPage } from "@/components/builds/build-page";

export const metadata: Metadata = { title: "Build" };

const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function BuildDetailPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor("read");
  const { id } = await params;
  if (!UUID_RE.test(id)) notFound();
  return <BuildPage id={id} viewer={{ userId: actor.userId, role: actor.role }} />;
}
