"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { useState } from "react";
import { apiCall, apiQuery, operationKey } from "@/lib/api/client";
import { createUser, listUsers, updateUser } from "@/lib/api/endpoints";
import type { CreateUserBody, UpdateUserBody } from "@/lib/api/operations/admin";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Field, Input, Select, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { Badge } from "@/components/ui/badge";
import { ErrorRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const createUserBodyResolver = lazyZodResolver(() => import("@/lib/api/operations/admin").then((m) => m.createUserBody));

export function UserAdmin({ currentUserId }: { currentUserId: string }) {
  const qc = useQueryClient();
  const users = useQuery(apiQuery(listUsers, {}));
  const form = useForm<CreateUserBody>({ resolver: createUserBodyResolver, defaultValues: { role: "viewer" } });
  const create = useMutation({
    mutationFn: (v: CreateUserBody) => apiCall(createUser, { body: v }),
    onError: (err) => showServerIssues(form, err),
    onSuccess: () => {
      // Clears the fields and any message left from an earlier failed try.
      form.reset({ email: "", name: "", password: "", role: "viewer" });
      form.clearErrors();
      void qc.invalidateQueries({ queryKey: operationKey(listUsers) });
    },
  });
  const update = useMutation({
    mutationFn: ({ id, ...patch }: UpdateUserBody & { id: string }) => apiCall(updateUser, { params: { id }, body: patch }),
    onMutate: () => setDone(null),
    onSuccess: ({ user }, patch) =>
      setDone(patch.role ? `${user.name}'s role is now ${ROLE_LABELS[user.role]}.` : patch.disabled ? `${user.name}'s account is disabled; they are signed out and their tokens stop working.` : `${user.name}'s account is enabled again.`),
    onSettled: () => void qc.invalidateQueries({ queryKey: operationKey(listUsers) }),
  });
  // What the last change did, said once it succeeded.
  const [done, setDone] = useState<string | null>(null);
  const { errors } = form.formState;
  // A role change or a disable waits here until the admin confirms it in the dialog.
  const [pending, setPending] = useState<{ id: string; name: string; email: string; role?: { from: Role; to: Role }; disable?: true } | null>(null);
  const confirm = () => {
    if (!pending) return;
    update.mutate(pending.role ? { id: pending.id, role: pending.role.to } : { id: pending.id, disabled: true }, { onSuccess: () => setPending(null) });
  };

  return (
    <div className="space-y-5">
      <Panel title="People">
        {update.error && !pending && <div className="mb-3"><ErrorNotice error={update.error} /></div>}
        {done && <div className="mb-3"><Notice tone="ok" role="status">{done}</Notice></div>}
        <Table caption="Users">
          <thead>
            <tr>
              <Th>Name</Th>
              <Th>E-mail</Th>
              <Th>Role</Th>
              <Th>State</Th>
              <Th />
            </tr>
          </thead>
          <tbody>
            {users.isPending && <SkeletonRows cols={5} />}
            {users.isError && <ErrorRow colSpan={5} error={users.error} onRetry={() => void users.refetch()} />}
            {users.data?.items.map((u) => (
              <tr key={u.id}>
                <Td className="font-medium">{u.name}</Td>
                <Td>{u.email}</Td>
                <Td>
                  <label className="sr-only" htmlFor={`role-${u.id}`}>Role of {u.name}</label>
                  <Select
                    id={`role-${u.id}`}
                    value={u.role}
                    disabled={u.id === currentUserId}
                    onChange={(e) => {
                      update.reset();
                      setPending({ id: u.id, name: u.name, email: u.email, role: { from: u.role, to: e.target.value as Role } });
                    }}
                    className="w-44 py-1"
                  >
                    {ROLES.map((r) => (
                      <option key={r} value={r}>{ROLE_LABELS[r]}</option>
                    ))}
                  </Select>
                </Td>
                <Td>{u.disabledAt ? <Badge tone="fault">disabled</Badge> : <Badge tone="ok">active</Badge>}</Td>
                <Td>
                  {u.id !== currentUserId && (
                    <Button
                      variant={u.disabledAt ? "secondary" : "danger"}
                      onClick={() => {
                        update.reset();
                        setDone(null);
                        if (u.disabledAt) update.mutate({ id: u.id, disabled: false });
                        else setPending({ id: u.id, name: u.name, email: u.email, disable: true });
                      }}
                    >
                      {u.disabledAt ? "Re-enable" : "Disable"} <span className="sr-only">{u.name}</span>
                    </Button>
                  )}
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </Panel>
      <ConfirmDialog
        open={pending !== null}
        title={pending?.role ? `Change ${pending.name}'s role to ${ROLE_LABELS[pending.role.to]}?` : `Disable ${pending?.name ?? ""}'s account?`}
        description={
          pending?.role ? (
            <p>
              {pending.name} ({pending.email}) goes from {ROLE_LABELS[pending.role.from]} to {ROLE_LABELS[pending.role.to]} at their next request, in the browser and through every API token they hold.
              Approvals they gave count only while their role may review builds.
            </p>
          ) : (
            <p>
              {pending?.name} ({pending?.email}) is signed out at their next request, cannot sign in, and every API token they hold stops working. Their approvals stop counting toward any build
              not yet promoted. You can re-enable the account later.
            </p>
          )
        }
        confirmLabel={pending?.role ? "Change role" : "Disable account"}
        variant={pending?.role ? "primary" : "danger"}
        pending={update.isPending}
        onClose={() => {
          setPending(null);
          update.reset();
        }}
        onConfirm={confirm}
      >
        {update.error && <Notice tone="fault" role="alert">{update.error.message}</Notice>}
      </ConfirmDialog>
      <Panel title="Add a user">
        <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v), () => create.reset())(e)} className="grid max-w-3xl gap-3 md:grid-cols-2" noValidate>
          {create.error && <div className="md:col-span-2"><ErrorNotice error={create.error} besideFields={fieldsOf(form)} /></div>}
          {create.isSuccess && <div className="md:col-span-2"><Notice tone="ok" role="status">User created.</Notice></div>}
          <Field id="new-name" label="Name" error={errors.name?.message}>
            <Input {...describedBy("new-name", errors.name?.message)} {...form.register("name")} />
          </Field>
          <Field id="new-email" label="E-mail" error={errors.email?.message}>
            <Input type="email" {...describedBy("new-email", errors.email?.message)} {...form.register("email")} />
          </Field>
          <Field id="new-role" label="Role" error={errors.role?.message}>
            <Select {...describedBy("new-role", errors.role?.message)} {...form.register("role")}>
              {ROLES.map((r) => (
                <option key={r} value={r}>{ROLE_LABELS[r]}</option>
              ))}
            </Select>
          </Field>
          <Field id="new-password" label="First password" hint="At least 12 characters; they change it on the Account page." error={errors.password?.message}>
            <Input type="password" autoComplete="new-password" {...describedBy("new-password", errors.password?.message)} {...form.register("password")} />
          </Field>
          <div className="md:col-span-2">
            <Button type="submit" disabled={create.isPending}>Create user</Button>
          </div>
        </form>
      </Panel>
    </div>
  );
}
