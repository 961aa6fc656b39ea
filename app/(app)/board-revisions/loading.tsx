import { PageSkeleton } from "@/components/ui/skeleton";

export default function BoardRevisionLoading() {
  return <PageSkeleton title="the board revision" kind="detail" />;
}
