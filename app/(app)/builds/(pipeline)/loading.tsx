import { PageSkeleton } from "@/components/ui/skeleton";

export default function BuildsLoading() {
  return <PageSkeleton title="the builds" kind="columns" />;
}
