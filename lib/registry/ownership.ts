import type { Role } from "@/lib/auth/roles";

/**
 * Who may publish a version into a profile: its owner, or an administrator (whose publish
 * into someone else's profile is recorded as done on the owner's behalf). Other engineers
 * may edit the shared draft but not publish from it: a published version is a promise
 * about a product, and its owner answers for it.
 * Returns why `actor` may not publish, or null when they may.
 */
export function publishRefusal(actor: { userId: string; role: Role }, profile: { ownerUserId: string; ownerName: string; name: string }): string | null {
  if (actor.userId === profile.ownerUserId || actor.role === "admin") return null;
  return `"${profile.name}" belongs to ${profile.ownerName}; only its owner or an administrator publishes its versions. Ask ${profile.ownerName} to publish, or create a profile of your own.`;
}
