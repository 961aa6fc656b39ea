import { PageSkeleton } from "@/components/ui/skeleton";

export default function DashboardLoading() {
  return <PageSkeleton title="the dashboard" kind="table" />;
}
