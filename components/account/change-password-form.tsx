"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { useState } from "react";
import { apiCall } from "@/lib/api/client";
import { AppError } from "@/lib/api/errors";
import { changePassword, changePasswordBody, type ChangePasswordBody } from "@/lib/api/operations/account";
import { Button } from "@/components/ui/button";
import { Field, Input, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";

export function ChangePasswordForm() {
  const [done, setDone] = useState(false);
  const { register, handleSubmit, setError, reset, formState } = useForm<ChangePasswordBody>({ resolver: zodResolver(changePasswordBody) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setDone(false);
    try {
      await apiCall(changePassword, { body: values });
      reset();
      setDone(true);
    } catch (err) {
      const e = err instanceof AppError ? err : new AppError("internal", "Could not change the password.");
      if (e.issues?.some((i) => i.path === "/currentPassword")) setError("currentPassword", { message: "Not your current password." });
      else setError("root", { message: e.message });
    }
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} className="max-w-sm space-y-3" noValidate>
      {done && <Notice tone="ok" role="status">Password changed.</Notice>}
      {errors.root?.message && <Notice tone="fault" role="alert">{errors.root.message}</Notice>}
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
