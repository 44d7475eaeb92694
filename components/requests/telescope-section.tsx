"use client";

import { Controller } from "react-hook-form";
import { CheckboxList } from "@/components/ui/checkbox-list";
import { Field, inputClass } from "@/components/ui/field";
import type { InstrumentOption } from "@/lib/requests/reference-queries";
import type { RequestForm, TelescopeOption } from "./form-types";

export function instrumentLabel(i: InstrumentOption): string {
  return `${i.telescopeCode} · ${i.code} — ${i.name} (limit V ${i.limitingMagnitude.toFixed(1)})`;
}

export function TelescopeSection({ form, telescopes, instruments }: { form: RequestForm; telescopes: TelescopeOption[]; instruments: InstrumentOption[] }) {
  const errors = form.formState.errors;
  const chosen = form.watch("telescopeIds") ?? [];
  // Offer the instruments of the chosen telescopes (all of them until one is chosen).
  const offered = chosen.length === 0 ? instruments : instruments.filter((i) => chosen.includes(i.telescopeId));
  return (
    <fieldset className="grid gap-x-4 sm:grid-cols-2">
      <legend className="mb-2 text-sm font-semibold">Telescopes and instrument</legend>
      <Controller
        control={form.control}
        name="telescopeIds"
        render={({ field }) => (
          <CheckboxList
            legend="Acceptable telescopes"
            className="sm:col-span-2"
            options={telescopes.map((t) => ({ value: t.id, label: `${t.code} — ${t.name}` }))}
            value={field.value ?? []}
            onChange={(next) => {
              field.onChange(next);
              const left = instruments.filter((i) => next.includes(i.telescopeId));
              // One instrument on the chosen telescopes: choose it, as anyone would.
              if (left.length === 1 && !form.getValues("instrumentId")) form.setValue("instrumentId", left[0]!.id, { shouldDirty: true });
            }}
            error={errors.telescopeIds?.message}
            hint={`Any of these may take the observation. Sites: ${[...new Set(telescopes.map((t) => t.siteName))].join(", ")}.`}
            empty="No telescopes are set up yet."
          />
        )}
      />
      <Field id="request-instrument" label="Instrument" error={errors.instrumentId?.message} hint="Its limiting magnitude sets the fading clock." className="sm:col-span-2">
        <select id="request-instrument" className={inputClass} aria-invalid={!!errors.instrumentId} {...form.register("instrumentId")}>
          <option value="">Choose…</option>
          {offered.map((i) => (
            <option key={i.id} value={i.id}>
              {instrumentLabel(i)}
            </option>
          ))}
        </select>
      </Field>
    </fieldset>
  );
}
