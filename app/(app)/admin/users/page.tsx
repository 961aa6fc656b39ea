import type { Metadata } from "next";
import { HydrationBoundary } from "@tanstack/react-query";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { prefetchScreen, screenQuery } from "@/lib/platform/screens/prefetch";
import { getDb } from "@/db/client";
import { listUsers } from "@/lib/api/operations/admin";
import { usersList } from "@/lib/use-cases/admin/read";
import { PageHeader } from "@/components/ui/panel";
import { UserAdmin } from "@/components/admin/user-admin";

export const metadata: Metadata = { title: "Users and roles" };

export default async function UsersPage() {
  const actor = await requirePageActor("admin");
  const state = await prefetchScreen(actor, [screenQuery(listUsers, {}, () => usersList(getDb()))]);
  return (
    <>
      <PageHeader title="Users and roles" subtitle="Create accounts, change roles, disable people who left. Disabling ends their sessions and tokens at once." />
      <HydrationBoundary state={state}>
        <UserAdmin currentUserId={actor.userId} />
      </HydrationBoundary>
    </>
  );
}
