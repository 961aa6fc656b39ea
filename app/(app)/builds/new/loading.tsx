import { PageSkeleton } from "@/components/ui/skeleton";

export default function NewBuildLoading() {
  return <PageSkeleton title="the new-build form" kind="form" />;
}
