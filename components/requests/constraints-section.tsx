"use client";

import { Field, inputClass } from "@/components/ui/field";
import { DARKNESS_LEVELS } from "@/db/types";
import { DARKNESS_LABELS } from "@/lib/requests/labels";
import type { RequestForm } from "./form-types";
import { TextField } from "./text-field";

export function ConstraintsSection({ form }: { form: RequestForm }) {
  const { register } = form;
  const errors = form.formState.errors.constraints;
  return (
    <fieldset className="grid gap-x-4 sm:grid-cols-2">
      <legend className="mb-2 text-sm font-semibold">Constraints</legend>
      <TextField
        id="request-max-airmass"
        label="Maximum airmass"
        inputMode="decimal"
        autoComplete="off"
        hint="Empty: the telescope's own limit."
        error={errors?.maxAirmass?.message}
        {...register("constraints.maxAirmass")}
      />
      <Field id="request-darkness" label="Darkness" error={errors?.darkness?.message}>
        <select id="request-darkness" className={inputClass} {...register("constraints.darkness")}>
          {DARKNESS_LEVELS.map((d) => (
            <option key={d} value={d}>
              {DARKNESS_LABELS[d]}
            </option>
          ))}
        </select>
      </Field>
      <TextField
        id="request-moon-separation"
        label="Minimum Moon separation (°)"
        inputMode="decimal"
        autoComplete="off"
        hint="Empty: none. Applies while the Moon is up."
        error={errors?.minMoonSeparationDeg?.message}
        {...register("constraints.minMoonSeparationDeg")}
      />
      <TextField
        id="request-moon-illumination"
        label="Maximum Moon illumination (0–1)"
        inputMode="decimal"
        autoComplete="off"
        hint="Empty: none. 0.5 is a half Moon."
        error={errors?.maxMoonIllumination?.message}
        {...register("constraints.maxMoonIllumination")}
      />
    </fieldset>
  );
}
