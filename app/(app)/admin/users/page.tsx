import type { Metadata } from "next";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { PageHeader } from "@/components/ui/panel";
import { UserAdmin } from "@/components/admin/user-admin";

export const metadata: Metadata = { title: "Users and roles" };

export default async function UsersPage() {
  const actor = await requirePageActor("admin");
  return (
    <>
      <PageHeader title="Users and roles" subtitle="Create accounts, change roles, disable people who left. Disabling ends their sessions and tokens at once." />
      <UserAdmin currentUserId={actor.userId} />
    </>
  );
}
