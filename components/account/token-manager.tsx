"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { useState } from "react";
import type { z } from "zod";
import { apiCall, apiQuery, operationKey } from "@/lib/api/client";
import { createToken, listTokens, revokeToken } from "@/lib/api/endpoints";
import { MAX_TOKEN_DAYS, MAX_LIVE_TOKENS } from "@/lib/api/limits";
import type { createTokenBody, TokenView } from "@/lib/api/operations/account";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Field, Input, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { EmptyRow, ErrorRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { Badge } from "@/components/ui/badge";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";
import { formatUtc } from "@/lib/time/format";
import { CopyButton } from "@/components/ui/copy-button";

function fmt(iso: string | null): string {
  return iso ? formatUtc(iso) : "—";
}

/** Days until an expiry, as people say it: a token made for 30 days expires "in 30 days", not 29 and some hours. */
function daysLeft(iso: string): string {
  const left = (new Date(iso).getTime() - Date.now()) / 86_400_000;
  if (left < 1) return "within a day";
  const days = Math.round(left);
  return `in ${days} day${days === 1 ? "" : "s"}`;
}

function tokenState(t: TokenView): { label: string; tone: "ok" | "neutral" | "fault" } {
  if (t.revokedAt) return { label: "revoked", tone: "fault" };
  if (new Date(t.expiresAt) < new Date()) return { label: "expired", tone: "neutral" };
  return { label: "active", tone: "ok" };
}

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const resolver = lazyZodResolver(() => import("@/lib/api/operations/account").then((m) => m.createTokenBody));

export function TokenManager() {
  const qc = useQueryClient();
  const [secret, setSecret] = useState<string | null>(null);
  const tokens = useQuery(apiQuery(listTokens, {}));
  const form = useForm<z.input<typeof createTokenBody>, unknown, z.output<typeof createTokenBody>>({
    resolver,
    defaultValues: { name: "", expiresInDays: 90 },
  });
  const create = useMutation({
    mutationFn: (values: z.output<typeof createTokenBody>) => apiCall(createToken, { body: values }),
    onSuccess: (res) => {
      setSecret(res.secret);
      form.reset({ name: "", expiresInDays: 90 });
      void qc.invalidateQueries({ queryKey: operationKey(listTokens) });
    },
    onError: (err) => showServerIssues(form, err),
  });
  const [revoking, setRevoking] = useState<TokenView | null>(null);
  const revoke = useMutation({
    mutationFn: (id: string) => apiCall(revokeToken, { params: { id } }),
    onSuccess: () => {
      setRevoking(null);
      void qc.invalidateQueries({ queryKey: operationKey(listTokens) });
    },
  });
  const { errors } = form.formState;

  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-700">
        Tokens let factory stations and firmware pipelines call <code>/api/v1</code> as you, with your role. Send one as{" "}
        <code>Authorization: Bearer …</code>.
      </p>
      {secret && (
        <Notice tone="ok" role="status" title="Copy this token now; it is not shown again">
          <div className="flex flex-wrap items-center gap-2">
            <code className="break-all rounded bg-white px-2 py-1 ring-1 ring-ink-200" data-testid="new-token-secret">
              {secret}
            </code>
            <CopyButton text={secret} label="Copy token" />
          </div>
        </Notice>
      )}
      <p className="text-sm text-ink-600">
        A token lives at most {MAX_TOKEN_DAYS} days, and you can hold at most {MAX_LIVE_TOKENS} live tokens; revoke one you no longer use to make room.
      </p>
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="flex flex-wrap items-end gap-3" noValidate>
        <div className="min-w-48 flex-1">
          <Field id="token-name" label="Name" error={errors.name?.message}>
            <Input {...describedBy("token-name", errors.name?.message)} placeholder="Line 2 flashing station" {...form.register("name")} />
          </Field>
        </div>
        <div className="w-28">
          <Field id="token-days" label="Valid for (days)" error={errors.expiresInDays?.message}>
            <Input type="number" min={1} max={MAX_TOKEN_DAYS} {...describedBy("token-days", errors.expiresInDays?.message)} {...form.register("expiresInDays", { valueAsNumber: true })} />
          </Field>
        </div>
        <Button type="submit" disabled={create.isPending}>
          Create token
        </Button>
      </form>
      <ErrorNotice error={create.error} besideFields={fieldsOf(form)} />
      <Table caption="Your API tokens">
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>Starts with</Th>
            <Th>Created</Th>
            <Th>Expires</Th>
            <Th>Last used</Th>
            <Th>State</Th>
            <Th><span className="sr-only">Actions</span></Th>
          </tr>
        </thead>
        <tbody>
          {tokens.isPending && <SkeletonRows rows={2} cols={7} />}
          {tokens.isError && <ErrorRow colSpan={7} error={tokens.error} onRetry={() => void tokens.refetch()} />}
          {tokens.data?.items.length === 0 && <EmptyRow colSpan={7}>No tokens yet.</EmptyRow>}
          {tokens.data?.items.map((t) => {
            const st = tokenState(t);
            return (
              <tr key={t.id}>
                <Td className="font-medium">{t.name}</Td>
                <Td><code className="text-xs">{t.tokenPrefix}…</code></Td>
                <Td className="whitespace-nowrap tabular-nums">{fmt(t.createdAt)}</Td>
                <Td className="whitespace-nowrap tabular-nums">
                  {fmt(t.expiresAt)}
                  {st.label === "active" && <span className="block text-xs text-ink-600">{daysLeft(t.expiresAt)}</span>}
                </Td>
                <Td className="whitespace-nowrap tabular-nums">{t.lastUsedAt ? fmt(t.lastUsedAt) : "never"}</Td>
                <Td><Badge tone={st.tone}>{st.label}</Badge></Td>
                <Td>
                  {st.label === "active" && (
                    <Button
                      variant="secondary"
                      onClick={() => {
                        revoke.reset();
                        setRevoking(t);
                      }}
                      aria-label={`Revoke ${t.name}`}
                    >
                      Revoke
                    </Button>
                  )}
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
      <ConfirmDialog
        open={revoking !== null}
        title={`Revoke the token "${revoking?.name ?? ""}"?`}
        description={
          <p>
            Every station or pipeline that sends the token starting with <code>{revoking?.tokenPrefix}…</code> is refused from its next request. This cannot be undone; make a new token if one is
            still needed.
          </p>
        }
        confirmLabel="Revoke token"
        pending={revoke.isPending}
        onClose={() => {
          setRevoking(null);
          revoke.reset();
        }}
        onConfirm={() => revoking && revoke.mutate(revoking.id)}
      >
        {revoke.error && <Notice tone="fault" role="alert">{revoke.error.message}</Notice>}
      </ConfirmDialog>
    </div>
  );
}
