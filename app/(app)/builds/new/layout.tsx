import { requirePageActor } from "@/lib/platform/auth/page-guard";

/**
 * The role check of the new-build form, made here as well as in its page: a layout runs
 * before the loading skeleton is sent, so a refused visitor gets a real 403 status.
 */
export default async function NewBuildLayout({ children }: { children: React.ReactNode }) {
  await requirePageActor("build:create");
  return children;
}
