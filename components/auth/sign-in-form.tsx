"use client";

import { signIn } from "next-auth/react";
import { useState } from "react";
import { formText } from "@/components/ui/form-data";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";

export function SignInForm({ callbackUrl }: { callbackUrl: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(null);
    const res = await signIn("credentials", {
      email: formText(form, "email"),
      password: formText(form, "password"),
      redirect: false,
    });
    setBusy(false);
    if (!res || res.error) {
      // One message for every failure: it never tells whether the account exists.
      setError("Sign-in failed. Check the e-mail and password; after several failures, wait 15 minutes.");
      return;
    }
    window.location.assign(callbackUrl);
  }

  return (
    <form onSubmit={(e) => void onSubmit(e)} className="space-y-4" noValidate>
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
