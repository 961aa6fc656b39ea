import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { PageHeader } from "@/components/ui/panel";
import { EstimateCaution } from "@/components/ui/notice";
import { NewBuildForm } from "@/components/builds/new-build-form";

export const metadata: Metadata = { title: "New build" };

export default async function NewBuildPage() {
  await requirePageActor("build:create");
  return (
    <>
      <PageHeader title="New build" subtitle="A firmware image and published profile versions in slots, for a range of board revisions. The server encodes and checks the bank." />
      <div className="space-y-4">
        <EstimateCaution />
        <NewBuildForm />
      </div>
    </>
  );
}
