"use client";

import { hex32 } from "@/lib/hex/address";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { memo, useEffect, useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { apiCall, apiQuery, operationKey } from "@/lib/api/client";
import { getProfile, getVersion, publishVersion } from "@/lib/api/endpoints";
import type { PublishBody } from "@/lib/api/operations/profile-schemas";
import { suggestNextVersion, type CoolingProfile } from "@/lib/engine";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, Textarea, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";
import { loadRangeMatch } from "./use-range-admission";
import { useSettled } from "./use-settled";

/** The publish body without the text (the editor's); its schema loads when the form first validates. */
const resolver = lazyZodResolver(() => import("@/lib/api/operations/profile-schemas").then((m) => m.publishBody.omit({ text: true })));
type PublishForm = Omit<PublishBody, "text">;

/** How long the document must rest before the version suggestion follows it, ms. */
const SUGGESTION_SETTLE_MS = 250;

interface PublishPanelProps {
  profileId: string;
  /** The editor's text as it is now: read when the form is sent. */
  getText: () => string;
  /** The latest published version, if any. */
  latest: { id: string; version: string } | undefined;
  /** The document in the editor when it passes the schema. */
  current: CoolingProfile | undefined;
  defaultRange: string;
  /** Called as the range is typed, so the memory gauge can judge it live. */
  onRangeChange?: (range: string) => void;
  blocked: boolean;
}

/**
 * Publish the editor's text as a new immutable version; the server encodes and checks it again.
 * The version number is suggested from what changed since the latest version (its document is
 * fetched here, and the rule and semver come with this form, not with the page). The suggestion
 * follows the document once it has rested, as the load sweep chart does: the form (its query,
 * the suggestion's comparison of both curves) is left alone while a drag or typing goes on. What
 * is sent is the editor's text when the form is sent, and the server checks it again.
 */
export function PublishPanel({ current, ...rest }: PublishPanelProps) {
  const settled = useSettled(current, SUGGESTION_SETTLE_MS);
  return <MemoPublishForm current={settled} {...rest} />;
}

const MemoPublishForm = memo(function PublishForm({ profileId, getText, latest, current, defaultRange, onRangeChange, blocked }: PublishPanelProps) {
  const qc = useQueryClient();
  const latestDoc = useQuery({
    ...apiQuery(getVersion, { params: { id: latest?.id ?? "" } }),
    enabled: Boolean(latest),
  });
  const latestDocument = latestDoc.data?.version.document as CoolingProfile | undefined;
  const suggestion = useMemo(() => (latest && latestDocument && current ? suggestNextVersion(latestDocument, current, latest.version) : null), [latest, latestDocument, current]);
  const suggested = suggestion?.version ?? "1.0.0";
  const form = useForm<PublishForm>({ resolver, defaultValues: { version: suggested, changelog: "", boardRange: defaultRange } });
  // Follow the suggestion until the engineer types their own number.
  const [followSuggestion, setFollowSuggestion] = useState(true);
  useEffect(() => {
    if (followSuggestion) form.setValue("version", suggested);
  }, [suggested, followSuggestion, form]);
  const publish = useMutation({
    mutationFn: (v: PublishForm) => apiCall(publishVersion, { params: { id: profileId }, body: { ...v, text: getText() } }),
    onSuccess: () => {
      form.reset({ version: suggested, changelog: "", boardRange: form.getValues("boardRange") });
      setFollowSuggestion(true);
      void qc.invalidateQueries({ queryKey: operationKey(getProfile, { params: { id: profileId } }) });
    },
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  return (
    <form onSubmit={(e) => void form.handleSubmit((v) => publish.mutate(v))(e)} className="space-y-3" noValidate aria-label="Publish a version">
      {suggestion && (
        <p className="text-sm text-ink-700" data-testid="suggestion">
          Suggested <strong>{suggestion.version}</strong> ({suggestion.bump}): {suggestion.reasons.join("; ")}.
        </p>
      )}
      {!suggestion && <p className="text-sm text-ink-700" data-testid="suggestion">First version: suggested <strong>1.0.0</strong>.</p>}
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="pub-version" label="Version" error={errors.version?.message}>
          <Input {...describedBy("pub-version", errors.version?.message)} {...form.register("version", { onChange: () => setFollowSuggestion(false) })} />
        </Field>
        <Field id="pub-range" label="Board revision range" hint='Semver range, e.g. ">=1.1.0 <3.0.0". The memory gauge checks every revision it admits as you type.' error={errors.boardRange?.message}>
          {/* Range matching (semver) is fetched as the field is entered, before the first character counts. */}
          <Input {...describedBy("pub-range", errors.boardRange?.message)} onFocus={() => void loadRangeMatch().catch(() => undefined)} {...form.register("boardRange", { onChange: (e: { target: { value: string } }) => onRangeChange?.(e.target.value) })} />
        </Field>
      </div>
      <Field id="pub-changelog" label="Changelog" error={errors.changelog?.message}>
        <Textarea rows={2} {...describedBy("pub-changelog", errors.changelog?.message)} {...form.register("changelog")} />
      </Field>
      <ErrorNotice error={publish.error} besideFields={fieldsOf(form)} />
      {publish.isSuccess && <Notice tone="ok" role="status">Published {publish.data.version.version} ({publish.data.version.encodedBytes} B, CRC-32 {hex32(publish.data.version.crc32)}).</Notice>}
      {blocked && <p className="text-sm text-signal-fault">Fix the errors in the problems list before publishing.</p>}
      <Button type="submit" disabled={publish.isPending || blocked}>Publish version</Button>
    </form>
  );
});
