import { PageSkeleton } from "@/components/ui/skeleton";

export default function LotsLoading() {
  return <PageSkeleton title="the production lots" kind="table" />;
}
