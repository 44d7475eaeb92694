"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { inputClass } from "@/components/ui/field";
import type { ActionResult } from "@/lib/actions/result";
import { cn } from "@/lib/cn";
import { EXECUTION_OUTCOMES } from "@/db/types";
import { OUTCOME_LABELS } from "@/lib/tonight/labels";
import { executionLogSchema, type ExecutionLogFormValues } from "@/lib/tonight/schemas";

export type LogExecutionAction = (input: unknown) => Promise<ActionResult>;

const UNEXPECTED: ActionResult = { ok: false, message: "The log did not reach the server and nothing was saved. Your entries are still here: try again." };

/** The night log of one block: what happened, minutes used (needed for partial), a note. */
export function ExecutionLogForm({
  blockId,
  label,
  scheduledMinutes,
  save,
  onSaved,
}: {
  blockId: string;
  /** Names the block for screen readers and the form's heading ("SCI-101, 01:00–03:00 UT"). */
  label: string;
  scheduledMinutes: number;
  save: LogExecutionAction;
  onSaved: () => Promise<unknown>;
}) {
  const [result, setResult] = useState<ActionResult | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<ExecutionLogFormValues>({
    resolver: zodResolver(executionLogSchema, undefined, { raw: true }),
    defaultValues: { outcome: undefined, note: "" },
  });
  const id = (field: string) => `log-${blockId}-${field}`;

  async function submit(values: ExecutionLogFormValues) {
    const minutes = typeof values.minutesUsed === "number" && !Number.isNaN(values.minutesUsed) ? values.minutesUsed : null;
    let answer: ActionResult;
    try {
      answer = await save({ ...values, minutesUsed: minutes, blockId });
    } catch {
      answer = UNEXPECTED;
    }
    setResult(answer);
    if (answer.ok) {
      reset({ outcome: undefined, note: "", minutesUsed: undefined });
      await onSaved();
    } else {
      for (const [field, message] of Object.entries(answer.fieldErrors ?? {})) {
        if (field === "outcome" || field === "minutesUsed" || field === "note") setError(field, { type: "server", message });
      }
    }
  }

  return (
    <form onSubmit={handleSubmit(submit)} noValidate aria-label={`Night log for ${label}`} className="grid gap-3 md:grid-cols-[auto_12rem_1fr_auto] md:items-start">
      <fieldset aria-describedby={`${id("outcome")}-error`}>
        <legend className="text-sm font-semibold uppercase tracking-wide text-muted">Outcome</legend>
        <div className="mt-1 grid gap-1">
          {EXECUTION_OUTCOMES.map((o) => (
            <label key={o} className="flex items-center gap-2">
              <input type="radio" value={o} className="tn-radio" aria-invalid={errors.outcome ? true : undefined} {...register("outcome")} />
              {OUTCOME_LABELS[o]}
            </label>
          ))}
        </div>
        <p id={`${id("outcome")}-error`} aria-live="polite" className="min-h-5 text-sm text-danger">
          {errors.outcome?.message}
        </p>
      </fieldset>
      <div className="flex flex-col gap-1">
        <label htmlFor={id("minutes")} className="text-sm font-semibold uppercase tracking-wide text-muted">
          Minutes used
        </label>
        <input
          id={id("minutes")}
          type="number"
          inputMode="numeric"
          min={0}
          max={scheduledMinutes}
          className={cn(inputClass, "num text-base")}
          aria-invalid={errors.minutesUsed ? true : undefined}
          aria-describedby={`${id("minutes")}-hint ${id("minutes")}-error`}
          {...register("minutesUsed", { valueAsNumber: true })}
        />
        <p id={`${id("minutes")}-hint`} className="text-sm text-muted">
          Needed for partial; the block has {scheduledMinutes}.
        </p>
        <p id={`${id("minutes")}-error`} aria-live="polite" className="min-h-5 text-sm text-danger">
          {errors.minutesUsed?.message}
        </p>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={id("note")} className="text-sm font-semibold uppercase tracking-wide text-muted">
          Note
        </label>
        <textarea id={id("note")} rows={3} className={cn(inputClass, "text-base")} aria-invalid={errors.note ? true : undefined} {...register("note")} />
        <p aria-live="polite" className="min-h-5 text-sm text-danger">
          {errors.note?.message}
        </p>
      </div>
      <div className="flex flex-col gap-2 md:pt-6">
        <button type="submit" disabled={isSubmitting} className="rounded-md bg-text px-4 py-2 text-base font-semibold text-surface hover:opacity-90 disabled:opacity-50">
          Save log
        </button>
        <p aria-live="polite" className={cn("max-w-56 text-sm", result && !result.ok ? "text-danger" : "text-ok")}>
          {result?.message}
        </p>
      </div>
    </form>
  );
}
