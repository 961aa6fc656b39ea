"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button type="button" onClick={() => void signOut({ callbackUrl: "/sign-in" })} className="text-sm text-ink-200 underline-offset-2 hover:text-white hover:underline">
      Sign out
    </button>
  );
}
