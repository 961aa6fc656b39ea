"use client";

/** Signs out through next-auth's client, loaded when the button is pressed rather than with every screen. */
async function signOutNow() {
  const { signOut } = await import("next-auth/react");
  await signOut({ callbackUrl: "/sign-in" });
}

export function SignOutButton() {
  return (
    <button type="button" onClick={() => void signOutNow()} className="text-sm text-ink-200 underline-offset-2 hover:text-white hover:underline">
      Sign out
    </button>
  );
}
