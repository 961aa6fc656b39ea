"use client";

import { useState } from "react";
import { formText } from "@/components/ui/form-data";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";

/** One message for every failure: it never tells whether the account exists. */
export const SIGN_IN_FAILED_MESSAGE =
  "Sign-in failed. Check the e-mail and password. After repeated failures from this device, each next try has to wait a little longer.";

/**
 * Posts to the sign-in endpoint even before the page's scripts have loaded (method="post",
 * so the password never lands in the address bar, the history or a server log); once the
 * scripts run, the same form signs in without a page load.
 */
export function SignInForm({ callbackUrl, csrfToken, initialError }: { callbackUrl: string; csrfToken: string; initialError: string | null }) {
  const [error, setError] = useState<string | null>(initialError);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const element = e.currentTarget;
    const form = new FormData(element);
    setBusy(true);
    setError(null);
    // next-auth's client loads with the first submit, not with the page; if it cannot be
    // loaded, the form posts the way it does without scripts.
    let signIn: typeof import("next-auth/react").signIn;
    try {
      ({ signIn } = await import("next-auth/react"));
    } catch {
      element.submit();
      return;
    }
    const res = await signIn("credentials", {
      email: formText(form, "email"),
      password: formText(form, "password"),
      redirect: false,
    });
    setBusy(false);
    if (!res || res.error) {
      setError(SIGN_IN_FAILED_MESSAGE);
      return;
    }
    window.location.assign(callbackUrl);
  }

  return (
    <form method="post" action="/api/auth/callback/credentials" onSubmit={(e) => void onSubmit(e)} className="space-y-4" noValidate>
      <input type="hidden" name="csrfToken" value={csrfToken} />
      <input type="hidden" name="callbackUrl" value={callbackUrl} />
      {error && (
        <div data-testid="sign-in-error">
          <Notice tone="fault" role="alert">
            {error}
          </Notice>
        </div>
      )}
      <Field id="email" label="E-mail">
        <Input id="email" name="email" type="email" autoComplete="username" required autoFocus />
      </Field>
      <Field id="password" label="Password">
        <Input id="password" name="password" type="password" autoComplete="current-password" required />
      </Field>
      <Button type="submit" disabled={busy} className="w-full justify-center">
        {busy ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
