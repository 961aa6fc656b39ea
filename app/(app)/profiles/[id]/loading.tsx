import { PageSkeleton } from "@/components/ui/skeleton";

export default function ProfileLoading() {
  return <PageSkeleton title="the profile" kind="detail" />;
}
