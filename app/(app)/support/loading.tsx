import { PageSkeleton } from "@/components/ui/skeleton";

export default function SupportLoading() {
  return <PageSkeleton title="the support page" kind="table" />;
}
