"use client";

import { Field, inputClass } from "@/components/ui/field";
import { REQUEST_URGENCIES } from "@/db/types";
import { URGENCY_LABELS } from "@/lib/requests/labels";
import type { RequestForm } from "./form-types";
import { TextField } from "./text-field";

export function WindowSection({ form }: { form: RequestForm }) {
  const { register } = form;
  const errors = form.formState.errors;
  return (
    <fieldset className="grid gap-x-4 sm:grid-cols-2">
      <legend className="mb-2 text-sm font-semibold">When</legend>
      <TextField
        id="request-duration"
        label="Time needed (minutes)"
        inputMode="numeric"
        autoComplete="off"
        hint="On sky, in one window."
        error={errors.durationMinutes?.message}
        {...register("durationMinutes")}
      />
      <Field id="request-urgency" label="Urgency" error={errors.urgency?.message}>
        <select id="request-urgency" className={inputClass} aria-invalid={!!errors.urgency} {...register("urgency")}>
          {REQUEST_URGENCIES.map((u) => (
            <option key={u} value={u}>
              {URGENCY_LABELS[u]}
            </option>
          ))}
        </select>
      </Field>
      <TextField id="request-earliest" type="datetime-local" label="Earliest start (UT)" error={errors.earliestStart?.message} className="num" {...register("earliestStart")} />
      <TextField
        id="request-latest"
        type="datetime-local"
        label="Latest end (UT)"
        hint="The observation may be made up to here."
        error={errors.latestEnd?.message}
        className="num"
        {...register("latestEnd")}
      />
      <TextField
        id="request-deadline"
        type="datetime-local"
        label="Deadline (UT)"
        hint="After this the result is no longer useful; the request lapses."
        error={errors.deadline?.message}
        className="num"
        {...register("deadline")}
      />
    </fieldset>
  );
}
