import { PageSkeleton } from "@/components/ui/skeleton";

export default function ProfilesLoading() {
  return <PageSkeleton title="the profiles" kind="table" />;
}
