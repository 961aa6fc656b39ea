import { PageSkeleton } from "@/components/ui/skeleton";

export default function BuildLoading() {
  return <PageSkeleton title="the build" kind="detail" />;
}
