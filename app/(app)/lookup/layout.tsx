import { requirePageActor } from "@/lib/platform/auth/page-guard";

/**
 * The section's role check, made here as well as in each page: a layout runs before the
 * section's loading skeleton is sent, so a refused visitor gets a real 403 status, not a
 * skeleton that turns into the refusal.
 */
export default async function LookupLayout({ children }: { children: React.ReactNode }) {
  await requirePageActor("support");
  return children;
}
