import { PageSkeleton } from "@/components/ui/skeleton";

export default function AdminLoading() {
  return <PageSkeleton title="the administration page" kind="table" />;
}
