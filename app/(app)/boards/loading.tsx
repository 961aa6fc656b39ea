import { PageSkeleton } from "@/components/ui/skeleton";

export default function BoardsLoading() {
  return <PageSkeleton title="the boards" kind="table" />;
}
