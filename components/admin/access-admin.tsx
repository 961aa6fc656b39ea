"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { apiCall, apiQuery, operationKey } from "@/lib/api/client";
import { formatUtc } from "@/lib/time/format";
import { clearSignInThrottle, listEveryonesTokens, listSignInThrottle, revokeAnyToken } from "@/lib/api/endpoints";
import type { OwnedTokenView } from "@/lib/api/operations/admin";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { Badge } from "@/components/ui/badge";
import { EmptyRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";

/** An instant as minutes in UTC, said so; a dash when there is none. */
function utc(iso: string | null): string {
  return iso ? formatUtc(iso) : "—";
}

function waitText(sec: number): string {
  if (sec <= 0) return "no wait";
  return sec < 120 ? `${sec} s` : `${Math.ceil(sec / 60)} min`;
}

/** Who is slowed down at sign-in (and unlocking them), and every API token (and revoking any). */
export function AccessAdmin() {
  const qc = useQueryClient();
  const throttle = useQuery(apiQuery(listSignInThrottle, {}));
  const tokens = useQuery(apiQuery(listEveryonesTokens, { query: { live: "true" } }));
  const [unlocking, setUnlocking] = useState<{ email: string; failures: number } | null>(null);
  const [revoking, setRevoking] = useState<OwnedTokenView | null>(null);
  const unlock = useMutation({
    mutationFn: (email: string) => apiCall(clearSignInThrottle, { body: { email } }),
    onSuccess: () => setUnlocking(null),
    onSettled: () => void qc.invalidateQueries({ queryKey: operationKey(listSignInThrottle) }),
  });
  const revoke = useMutation({
    mutationFn: (id: string) => apiCall(revokeAnyToken, { params: { id } }),
    onSuccess: () => setRevoking(null),
    onSettled: () => void qc.invalidateQueries({ queryKey: operationKey(listEveryonesTokens) }),
  });
  const windowMinutes = throttle.data?.windowMinutes ?? 15;

  return (
    <div className="space-y-5">
      <Panel title="Failed sign-ins">
        <p className="mb-3 text-sm text-ink-700">
          Wrong passwords slow down the client that sent them (2 free tries, then a doubling wait); the account&apos;s owner on a device with no recent failure still signs in.
          Counts cover the last {windowMinutes} minutes. Unlock an account only after its owner confirms the failures were theirs.
        </p>
        {unlock.isSuccess && <div className="mb-3"><Notice tone="ok" role="status">Failed sign-ins forgotten ({unlock.data.cleared} records).</Notice></div>}
        <Table caption="Accounts with failed sign-ins">
          <thead>
            <tr>
              <Th>Account</Th>
              <Th>Failures</Th>
              <Th>Clients</Th>
              <Th>Longest wait</Th>
              <Th>Window ends</Th>
              <Th />
            </tr>
          </thead>
          <tbody>
            {throttle.isPending && <SkeletonRows cols={6} />}
            {throttle.isError && <EmptyRow colSpan={6}>Could not load the failed sign-ins.</EmptyRow>}
            {throttle.data?.accounts.length === 0 && <EmptyRow colSpan={6}>No failed sign-ins in the last {windowMinutes} minutes.</EmptyRow>}
            {throttle.data?.accounts.map((a) => (
              <tr key={a.email}>
                <Td>{a.email}</Td>
                <Td className="tabular-nums">{a.failures}</Td>
                <Td className="tabular-nums">{a.clients}</Td>
                <Td className="tabular-nums">{waitText(a.longestWaitSec)}</Td>
                <Td className="tabular-nums">{utc(a.windowEndsAt)}</Td>
                <Td>
                  <Button variant="secondary" onClick={() => setUnlocking(a)}>
                    Unlock…
                  </Button>
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
        {throttle.data && throttle.data.addresses.length > 0 && (
          <Table caption="Client addresses with failed sign-ins">
            <thead>
              <tr>
                <Th>Address</Th>
                <Th>Failures</Th>
                <Th>Wait</Th>
              </tr>
            </thead>
            <tbody>
              {throttle.data.addresses.map((a) => (
                <tr key={a.address}>
                  <Td className="font-mono">{a.address}</Td>
                  <Td className="tabular-nums">{a.failures}</Td>
                  <Td className="tabular-nums">{waitText(a.waitSec)}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </Panel>
      <Panel title="Live API tokens of everyone">
        {revoke.isSuccess && <div className="mb-3"><Notice tone="ok" role="status">Token {revoke.data.token.name} revoked.</Notice></div>}
        <Table caption="Live API tokens">
          <thead>
            <tr>
              <Th>Owner</Th>
              <Th>Name</Th>
              <Th>Prefix</Th>
              <Th>Last used</Th>
              <Th>Expires</Th>
              <Th />
            </tr>
          </thead>
          <tbody>
            {tokens.isPending && <SkeletonRows cols={6} />}
            {tokens.isError && <EmptyRow colSpan={6}>Could not load the tokens.</EmptyRow>}
            {tokens.data?.items.length === 0 && <EmptyRow colSpan={6}>No live tokens.</EmptyRow>}
            {tokens.data?.items.map((t) => (
              <tr key={t.id}>
                <Td>
                  {t.userName} <span className="text-ink-600">({t.userEmail})</span>
                </Td>
                <Td>{t.name}</Td>
                <Td className="font-mono">{t.tokenPrefix}…</Td>
                <Td className="tabular-nums">{utc(t.lastUsedAt)}</Td>
                <Td className="tabular-nums">{utc(t.expiresAt)}</Td>
                <Td>
                  {t.revokedAt ? (
                    <Badge tone="fault">revoked</Badge>
                  ) : (
                    <Button variant="secondary" onClick={() => setRevoking(t)}>
                      Revoke…
                    </Button>
                  )}
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </Panel>
      <ConfirmDialog
        open={unlocking !== null}
        title={`Unlock ${unlocking?.email ?? ""}`}
        description={`Forgets all ${unlocking?.failures ?? 0} failed sign-ins on ${unlocking?.email ?? ""} from every client, so a client that was guessing may try again at once. This is recorded in the audit log.`}
        confirmLabel="Unlock"
        pending={unlock.isPending}
        onConfirm={() => unlocking && unlock.mutate(unlocking.email)}
        onClose={() => setUnlocking(null)}
      >
        {unlock.error && <Notice tone="fault" role="alert">{unlock.error.message}</Notice>}
      </ConfirmDialog>
      <ConfirmDialog
        open={revoking !== null}
        title={`Revoke ${revoking?.userName ?? ""}'s token “${revoking?.name ?? ""}”`}
        description={`Every script or machine using the token ${revoking?.tokenPrefix ?? ""}… stops working at once. A revoked token cannot be brought back; its owner makes a new one.`}
        confirmLabel="Revoke token"
        pending={revoke.isPending}
        onConfirm={() => revoking && revoke.mutate(revoking.id)}
        onClose={() => setRevoking(null)}
      >
        {revoke.error && <Notice tone="fault" role="alert">{revoke.error.message}</Notice>}
      </ConfirmDialog>
    </div>
  );
}
