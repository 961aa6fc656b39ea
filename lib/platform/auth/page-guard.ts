import "server-only";
import { forbidden, redirect } from "next/navigation";
import { can, type Capability } from "@/lib/auth/roles";
import { getSessionActor, type Actor } from "@/lib/platform/auth/actor";

/**
 * The guard every page and layout calls first: signed-out visitors go to sign-in, a role
 * without the capability gets the 403 page. Hiding a button is never the check; this is.
 */
export async function requirePageActor(capability: Capability = "read", callbackPath?: string): Promise<Actor> {
  const actor = await getSessionActor();
  if (!actor) redirect(callbackPath ? `/sign-in?callbackUrl=${encodeURIComponent(callbackPath)}` : "/sign-in");
  if (!can(actor.role, capability)) forbidden();
  return actor;
}
