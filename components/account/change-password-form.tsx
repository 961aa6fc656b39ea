"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { useState } from "react";
import { apiCall } from "@/lib/api/client";
import { changePassword, changePasswordBody, type ChangePasswordBody } from "@/lib/api/operations/account";
import { Button } from "@/components/ui/button";
import { Field, Input, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";

export function ChangePasswordForm() {
  const [done, setDone] = useState(false);
  const [serverError, setServerError] = useState<unknown>(null);
  const form = useForm<ChangePasswordBody>({ resolver: zodResolver(changePasswordBody) });
  const { register, handleSubmit, reset, formState } = form;
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setDone(false);
    setServerError(null);
    try {
      await apiCall(changePassword, { body: values });
      reset();
      setDone(true);
    } catch (err) {
      showServerIssues(form, err);
      setServerError(err);
    }
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} className="max-w-sm space-y-3" noValidate>
      {done && <Notice tone="ok" role="status">Password changed.</Notice>}
      <ErrorNotice error={serverError} besideFields={fieldsOf(form)} />
      <Field id="currentPassword" label="Current password" error={errors.currentPassword?.message}>
        <Input type="password" autoComplete="current-password" {...describedBy("currentPassword", errors.currentPassword?.message)} {...register("currentPassword")} />
      </Field>
      <Field id="newPassword" label="New password" hint="At least 12 characters." error={errors.newPassword?.message}>
        <Input type="password" autoComplete="new-password" {...describedBy("newPassword", errors.newPassword?.message)} {...register("newPassword")} />
      </Field>
      <Button type="submit" disabled={isSubmitting}>
        Change password
      </Button>
    </form>
  );
}
