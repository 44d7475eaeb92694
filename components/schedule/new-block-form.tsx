"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { useState } from "react";
import { TimeRange } from "@/components/time/time-range";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { BLOCK_KINDS, type BlockKind } from "@/db/types";
import type { CalendarTelescope } from "@/lib/schedule/calendar-queries";
import { blockInputSchema } from "@/lib/schedule/schemas";
import { KIND_LABELS } from "./kind-colors";
import { fetchJson } from "./use-schedule";

export interface NewBlockOptions {
  programs: Array<{ id: string; code: string; title: string; category: BlockKind }>;
  observers: Array<{ id: string; name: string }>;
  instruments: Array<{ id: string; code: string; name: string; telescopeId: string }>;
}

type FormInput = z.input<typeof blockInputSchema>;
type FormOutput = z.output<typeof blockInputSchema>;
const noneToNull = (v: unknown) => (v === "" ? null : v);

export function NewBlockForm({
  telescope,
  start,
  end,
  options,
  onDone,
  onCancel,
}: {
  telescope: CalendarTelescope;
  start: string;
  end: string;
  options: NewBlockOptions;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(blockInputSchema),
    defaultValues: { telescopeId: telescope.id, startsAt: start, endsAt: end, kind: "science", observerUserId: null, instrumentId: null },
  });
  const instruments = options.instruments.filter((i) => i.telescopeId === telescope.id);

  async function onSubmit(values: FormOutput) {
    setFailure(null);
    try {
      await fetchJson("/api/v1/blocks", { method: "POST", body: JSON.stringify(values) });
      const program = options.programs.find((p) => p.id === values.programId);
      onDone(`Added a block for ${program?.code ?? "the program"}.`);
    } catch (e) {
      setFailure(e instanceof Error ? e.message : "The block could not be added.");
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate aria-label="New block" className="rounded-lg border border-line bg-raised p-4">
      <h2 className="mb-1 font-semibold">New block on {telescope.name}</h2>
      <div className="mb-3"><TimeRange start={new Date(start)} end={new Date(end)} timeZone={telescope.timeZone} /></div>
      <Field id="nb-program" label="Program" error={errors.programId?.message}>
        <select
          id="nb-program"
          className={inputClass}
          {...register("programId", {
            onChange: (e: { target: { value: string } }) => {
              const program = options.programs.find((p) => p.id === e.target.value);
              if (program) setValue("kind", program.category);
            },
          })}
        >
          <option value="">Choose…</option>
          {options.programs.map((p) => (
            <option key={p.id} value={p.id}>{p.code} — {p.title}</option>
          ))}
        </select>
      </Field>
      <Field id="nb-kind" label="Kind" error={errors.kind?.message}>
        <select id="nb-kind" className={inputClass} {...register("kind")}>
          {BLOCK_KINDS.map((k) => <option key={k} value={k}>{KIND_LABELS[k]}</option>)}
        </select>
      </Field>
      <Field id="nb-observer" label="Observer" error={errors.observerUserId?.message}>
        <select id="nb-observer" className={inputClass} {...register("observerUserId", { setValueAs: noneToNull })}>
          <option value="">None yet</option>
          {options.observers.map((o) => <option key={o.id} value={o.id}>{o.name}</option>)}
        </select>
      </Field>
      <Field id="nb-instrument" label="Instrument" error={errors.instrumentId?.message}>
        <select id="nb-instrument" className={inputClass} {...register("instrumentId", { setValueAs: noneToNull })}>
          <option value="">Not set</option>
          {instruments.map((i) => <option key={i.id} value={i.id}>{i.code} — {i.name}</option>)}
        </select>
      </Field>
      {errors.endsAt && <Alert tone="error">{errors.endsAt.message}</Alert>}
      {failure && <Alert tone="error">{failure}</Alert>}
      <div className="mt-3 flex gap-2">
        <Button type="submit" disabled={isSubmitting}>{isSubmitting ? "Adding…" : "Add block"}</Button>
        <Button type="button" variant="quiet" onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
