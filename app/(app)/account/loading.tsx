import { PageSkeleton } from "@/components/ui/skeleton";

export default function AccountLoading() {
  return <PageSkeleton title="your account" kind="form" />;
}
