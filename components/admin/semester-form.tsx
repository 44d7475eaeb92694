"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import type { ActionResult } from "@/lib/actions/result";
import { emptySemesterForm, semesterSchema, type SemesterFormValues } from "@/lib/semesters/schemas";
import { FormInput } from "./form-controls";
import { FormFooter } from "./form-footer";
import { useEditorForm } from "./use-save-action";

export function SemesterForm({
  semesterId,
  initial,
  action,
}: {
  /** null: create a new semester. */
  semesterId: string | null;
  initial: SemesterFormValues;
  action: (id: string | null, input: unknown) => Promise<ActionResult>;
}) {
  const { register, formState: { errors, isSubmitting }, result, onSubmit } = useEditorForm({
    id: semesterId,
    initial,
    empty: emptySemesterForm,
    resolver: zodResolver(semesterSchema, undefined, { raw: true }),
    action,
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={semesterId ? "Edit the semester" : "Create a semester"} className="grid gap-x-4 sm:grid-cols-3">
      <FormInput id="semester-code" label="Code" error={errors.code?.message} hint="e.g. 2027A." {...register("code")} />
      {/* datetime-local has no zone: we read it as UT, never as the browser's local time. */}
      <FormInput id="semester-starts" label="Starts (UT)" type="datetime-local" error={errors.startsAt?.message} hint="Date and time in UT." {...register("startsAt")} />
      <FormInput id="semester-ends" label="Ends (UT)" type="datetime-local" error={errors.endsAt?.message} hint="The first instant after the semester." {...register("endsAt")} />
      <FormFooter submitLabel={semesterId ? "Save semester" : "Create semester"} pending={isSubmitting} result={result} />
    </form>
  );
}
