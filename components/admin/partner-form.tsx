"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { ActionResult } from "@/lib/actions/result";
import { emptyPartnerForm, partnerSchema, type PartnerFormValues } from "@/lib/partners/schemas";
import { FormInput } from "./form-controls";
import { FormFooter } from "./form-footer";
import { useSaveAction } from "./use-save-action";

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
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<PartnerFormValues>({ resolver: zodResolver(partnerSchema, undefined, { raw: true }), defaultValues: initial });
  const { result, submit } = useSaveAction<PartnerFormValues>((v) => action(partnerId, v), setError, (v) => reset(partnerId ? v : emptyPartnerForm));

  return (
    <form onSubmit={handleSubmit(submit)} noValidate aria-label={partnerId ? "Edit the partner" : "Create a partner"} className="grid gap-x-4 sm:grid-cols-3">
      <FormInput id="partner-code" label="Code" error={errors.code?.message} hint="Short and unique, e.g. AUR." {...register("code")} />
      <FormInput id="partner-name" label="Name" error={errors.name?.message} className="sm:col-span-2" {...register("name")} />
      <FormFooter submitLabel={partnerId ? "Save partner" : "Create partner"} pending={isSubmitting} result={result} />
    </form>
  );
}
