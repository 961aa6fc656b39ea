import { PageSkeleton } from "@/components/ui/skeleton";

export default function LookupLoading() {
  return <PageSkeleton title="the serial lookup" kind="form" />;
}
