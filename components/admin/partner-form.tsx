"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import type { ActionResult } from "@/lib/actions/result";
import { emptyPartnerForm, partnerSchema, type PartnerFormValues } from "@/lib/partners/schemas";
import { FormInput } from "./form-controls";
import { FormFooter } from "./form-footer";
import { useEditorForm } from "./use-save-action";

export function PartnerForm({
  partnerId,
  initial,
  action,
}: {
  /** null: create a new partner. */
  partnerId: string | null;
  initial: PartnerFormValues;
  action: (id: string | null, input: unknown) => Promise<ActionResult>;
}) {
  const { register, formState: { errors, isSubmitting }, result, onSubmit } = useEditorForm({
    id: partnerId,
    initial,
    empty: emptyPartnerForm,
    resolver: zodResolver(partnerSchema, undefined, { raw: true }),
    action,
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={partnerId ? "Edit the partner" : "Create a partner"} className="grid gap-x-4 sm:grid-cols-3">
      <FormInput id="partner-code" label="Code" error={errors.code?.message} hint="Short and unique, e.g. AUR." {...register("code")} />
      <FormInput id="partner-name" label="Name" error={errors.name?.message} className="sm:col-span-2" {...register("name")} />
      <FormFooter submitLabel={partnerId ? "Save partner" : "Create partner"} pending={isSubmitting} result={result} />
    </form>
  );
}
