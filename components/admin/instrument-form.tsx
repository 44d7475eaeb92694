"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import type { ActionResult } from "@/lib/actions/result";
import { emptyInstrumentForm, instrumentSchema, type InstrumentFormValues } from "@/lib/instruments/schemas";
import { FormInput, FormSelect, type SelectOption } from "./form-controls";
import { FormFooter } from "./form-footer";
import { useEditorForm } from "./use-save-action";

export function InstrumentForm({
  instrumentId,
  initial,
  telescopes,
  action,
}: {
  /** null: create a new instrument. */
  instrumentId: string | null;
  initial: InstrumentFormValues;
  telescopes: SelectOption[];
  action: (id: string | null, input: unknown) => Promise<ActionResult>;
}) {
  const { register, formState: { errors, isSubmitting }, result, onSubmit } = useEditorForm({
    id: instrumentId,
    initial,
    empty: emptyInstrumentForm,
    resolver: zodResolver(instrumentSchema, undefined, { raw: true }),
    action,
  });

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={instrumentId ? "Edit the instrument" : "Create an instrument"}
      className="grid gap-x-4 sm:grid-cols-2 lg:grid-cols-4"
    >
      <FormSelect id="instrument-telescope" label="Telescope" options={telescopes} error={errors.telescopeId?.message} {...register("telescopeId")} />
      <FormInput id="instrument-code" label="Code" error={errors.code?.message} hint="Unique on its telescope." {...register("code")} />
      <FormInput id="instrument-name" label="Name" error={errors.name?.message} {...register("name")} />
      <FormInput
        id="instrument-limiting-magnitude"
        label="Limiting magnitude"
        type="number"
        step="any"
        error={errors.limitingMagnitude?.message}
        hint="Faintest it reaches, e.g. 23.5."
        {...register("limitingMagnitude")}
      />
      <FormFooter submitLabel={instrumentId ? "Save instrument" : "Create instrument"} pending={isSubmitting} result={result} />
    </form>
  );
}
