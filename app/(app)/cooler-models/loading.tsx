import { PageSkeleton } from "@/components/ui/skeleton";

export default function CoolerModelsLoading() {
  return <PageSkeleton title="the cooler models" kind="table" />;
}
