"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { apiCall } from "@/lib/api/client";
import { createProfile } from "@/lib/api/endpoints";
import type { CreateProfileBody } from "@/lib/api/operations/profile-schemas";
import type { CoolerModelView } from "@/lib/api/operations/registry-schemas";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, Select, Textarea, describedBy } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const createProfileBodyResolver = lazyZodResolver(() => import("@/lib/api/operations/profile-schemas").then((m) => m.createProfileBody));

/** Starts a profile for a cooler model and opens its editor. */
export function CreateProfileForm({ coolers }: { coolers: CoolerModelView[] }) {
  const router = useRouter();
  const form = useForm<CreateProfileBody>({ resolver: createProfileBodyResolver, defaultValues: { description: "" } });
  const create = useMutation({
    mutationFn: (v: CreateProfileBody) => apiCall(createProfile, { body: v }),
    onSuccess: (res) => router.push(`/profiles/${res.profile.id}`),
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  return (
    <Panel title="Start a profile">
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="grid max-w-3xl gap-3 md:grid-cols-2" noValidate>
        {create.error && <div className="md:col-span-2"><ErrorNotice error={create.error} besideFields={fieldsOf(form)} /></div>}
        <Field id="p-cooler" label="Cooler model" error={errors.coolerModelId?.message}>
          <Select {...describedBy("p-cooler", errors.coolerModelId?.message)} {...form.register("coolerModelId")}>
            <option value="">Choose…</option>
            {coolers.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
          </Select>
        </Field>
        <Field id="p-name" label="Profile name" error={errors.name?.message}>
          <Input {...describedBy("p-name", errors.name?.message)} {...form.register("name")} />
        </Field>
        <div className="md:col-span-2">
          <Field id="p-desc" label="Description" hint="What the profile is for; shown in the list." error={errors.description?.message}>
            <Textarea rows={2} {...describedBy("p-desc", errors.description?.message)} {...form.register("description")} />
          </Field>
        </div>
        <div className="md:col-span-2">
          <Button type="submit" disabled={create.isPending}>Create and open the editor</Button>
        </div>
      </form>
    </Panel>
  );
}
