"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { Controller } from "react-hook-form";
import { CheckboxList, type CheckboxOption } from "@/components/ui/checkbox-list";
import type { ActionResult } from "@/lib/actions/result";
import { CATEGORY_LABELS, emptyProgramForm, PROGRAM_CATEGORIES, programSchema, type ProgramFormValues } from "@/lib/programs/schemas";
import { FormInput, FormSelect, type SelectOption } from "./form-controls";
import { FormFooter } from "./form-footer";
import { useEditorForm } from "./use-save-action";

const RANKS: SelectOption[] = [1, 2, 3, 4, 5].map((r) => ({ value: String(r), label: r === 1 ? "1 (highest)" : r === 5 ? "5 (lowest)" : String(r) }));
const CATEGORIES: SelectOption[] = PROGRAM_CATEGORIES.map((c) => ({ value: c, label: CATEGORY_LABELS[c] }));

export function ProgramForm({
  programId,
  initial,
  semesters,
  partners,
  pis,
  observers,
  action,
}: {
  /** null: create a new program. */
  programId: string | null;
  initial: ProgramFormValues;
  semesters: SelectOption[];
  partners: SelectOption[];
  pis: SelectOption[];
  observers: CheckboxOption[];
  action: (id: string | null, input: unknown) => Promise<ActionResult>;
}) {
  const { register, control, formState: { errors, isSubmitting }, result, onSubmit } = useEditorForm({
    id: programId,
    initial,
    empty: emptyProgramForm,
    resolver: zodResolver(programSchema, undefined, { raw: true }),
    action,
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={programId ? "Edit the program" : "Create a program"} className="grid gap-x-4 sm:grid-cols-2 lg:grid-cols-4">
      <FormInput id="program-code" label="Code" error={errors.code?.message} hint="Short and unique, e.g. SCI-101." {...register("code")} />
      <FormInput id="program-title" label="Title" error={errors.title?.message} className="sm:col-span-1 lg:col-span-3" {...register("title")} />
      <FormSelect id="program-semester" label="Semester" options={semesters} error={errors.semesterId?.message} {...register("semesterId")} />
      <FormSelect id="program-partner" label="Partner" options={partners} error={errors.partnerId?.message} {...register("partnerId")} />
      <FormSelect id="program-pi" label="PI" options={pis} error={errors.piUserId?.message} hint="People with the PI role." {...register("piUserId")} />
      <FormSelect id="program-category" label="Category" options={CATEGORIES} error={errors.category?.message} {...register("category")} />
      <FormSelect id="program-rank" label="Rank" options={RANKS} error={errors.rank?.message} hint="Low ranks are displaced first." {...register("rank")} />
      <FormInput id="program-hours" label="Allocated hours" type="number" step="any" error={errors.allocatedHours?.message} {...register("allocatedHours")} />
      <div className="flex flex-col gap-1">
        <span className="text-xs font-semibold uppercase tracking-wide text-muted" aria-hidden="true">
          Overrides
        </span>
        <label className="flex items-center gap-1.5 pt-1.5 text-sm">
          <input type="checkbox" aria-describedby="program-too-error" {...register("tooAllowed")} />
          ToO requests allowed
        </label>
        <p id="program-too-error" aria-live="polite" className="min-h-4 text-xs text-danger">
          {errors.tooAllowed?.message}
        </p>
      </div>
      <Controller
        control={control}
        name="observerUserIds"
        render={({ field, fieldState }) => (
          <CheckboxList
            legend="Observers"
            options={observers}
            value={field.value}
            onChange={field.onChange}
            error={fieldState.error?.message}
            empty="No one holds the observer role yet."
            className="col-span-full"
          />
        )}
      />
      <FormFooter submitLabel={programId ? "Save program" : "Create program"} pending={isSubmitting} result={result} />
    </form>
  );
}
