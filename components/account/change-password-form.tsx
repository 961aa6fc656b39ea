"use client";

import { useForm, useWatch } from "react-hook-form";
import { useMemo, useState } from "react";
import type { z } from "zod";
import { apiCall } from "@/lib/api/client";
import { changePassword } from "@/lib/api/endpoints";
import type { changePasswordBody } from "@/lib/api/operations/account";
import { MAX_PASSWORD_BYTES, MIN_PASSWORD_CHARS } from "@/lib/auth/password-limits";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";
import { PasswordStrength } from "./password-strength";

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const resolver = lazyZodResolver(() => import("@/lib/api/operations/account").then((m) => m.changePasswordBody));

type Result = { otherSessionsEnded: number; tokensRevoked: number };

export function ChangePasswordForm({ email, name }: { email: string; name: string }) {
  const [done, setDone] = useState<Result | null>(null);
  const [serverError, setServerError] = useState<unknown>(null);
  const form = useForm<z.input<typeof changePasswordBody>, unknown, z.output<typeof changePasswordBody>>({
    resolver,
    defaultValues: { currentPassword: "", newPassword: "", revokeTokens: false },
  });
  const { register, handleSubmit, reset, formState, control } = form;
  const { errors, isSubmitting } = formState;
  const newPassword = useWatch({ control, name: "newPassword" }) ?? "";
  const userInputs = useMemo(() => [email, name, "loopkeeper", "tarnwell"], [email, name]);

  const onSubmit = handleSubmit(async (values) => {
    setDone(null);
    setServerError(null);
    try {
      setDone(await apiCall(changePassword, { body: values }));
      reset();
    } catch (err) {
      showServerIssues(form, err);
      setServerError(err);
    }
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} className="max-w-sm space-y-3" noValidate>
      {done && (
        <Notice tone="ok" role="status">
          Password changed. {done.otherSessionsEnded === 1 ? "1 other session was" : `${done.otherSessionsEnded} other sessions were`} signed out
          {done.tokensRevoked ? `, and ${done.tokensRevoked} API token${done.tokensRevoked === 1 ? " was" : "s were"} revoked` : ""}.
        </Notice>
      )}
      <ErrorNotice error={serverError} besideFields={fieldsOf(form)} />
      <Field id="currentPassword" label="Current password" error={errors.currentPassword?.message}>
        <Input type="password" autoComplete="current-password" {...describedBy("currentPassword", errors.currentPassword?.message)} {...register("currentPassword")} />
      </Field>
      <Field
        id="newPassword"
        label="New password"
        hint={`At least ${MIN_PASSWORD_CHARS} characters and at most ${MAX_PASSWORD_BYTES} bytes; a few unrelated words work well. Common and breached passwords are refused.`}
        error={errors.newPassword?.message}
      >
        <Input type="password" autoComplete="new-password" {...describedBy("newPassword", errors.newPassword?.message)} {...register("newPassword")} />
      </Field>
      <PasswordStrength password={newPassword} userInputs={userInputs} />
      <label className="flex items-start gap-2 text-sm">
        <input type="checkbox" className="mt-1" {...register("revokeTokens")} />
        <span>Also revoke all my API tokens (do this if the old password may have leaked; scripts using them will need new ones).</span>
      </label>
      <p className="text-xs text-ink-600">Changing the password signs out your other sessions on every device; this one stays signed in.</p>
      <Button type="submit" disabled={isSubmitting}>
        Change password
      </Button>
    </form>
  );
}
