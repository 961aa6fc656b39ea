import { PageSkeleton } from "@/components/ui/skeleton";

export default function ComponentsLoading() {
  return <PageSkeleton title="the fans and pumps" kind="table" />;
}
