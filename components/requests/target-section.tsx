"use client";

import { Field, inputClass } from "@/components/ui/field";
import type { ProgramOption } from "@/lib/requests/reference-queries";
import { EphemerisInput } from "./ephemeris-input";
import type { RequestForm } from "./form-types";
import { TextField } from "./text-field";

export function TargetSection({ form, programs, attachEphemeris }: { form: RequestForm; programs: ProgramOption[]; attachEphemeris: (file: File) => Promise<boolean> }) {
  const { register, watch } = form;
  const errors = form.formState.errors;
  const kind = watch("target.kind");
  return (
    <fieldset className="grid gap-x-4 sm:grid-cols-2">
      <legend className="mb-2 text-sm font-semibold">Program and target</legend>
      <Field id="request-program" label="Program" error={errors.programId?.message} hint={programs.length === 0 ? "You lead no program with ToO time." : undefined}>
        <select id="request-program" className={inputClass} aria-invalid={!!errors.programId} {...register("programId")}>
          <option value="">Choose…</option>
          {programs.map((p) => (
            <option key={p.id} value={p.id}>
              {p.code} — {p.title}
            </option>
          ))}
        </select>
      </Field>
      <TextField id="request-target-name" label="Target name" autoComplete="off" error={errors.targetName?.message} {...register("targetName")} />
      <fieldset className="flex flex-col gap-1 sm:col-span-2">
        <legend className="text-xs font-semibold uppercase tracking-wide text-muted">Target position</legend>
        <div className="flex flex-wrap gap-x-5 gap-y-1 pt-1 text-sm">
          <label className="flex items-center gap-1.5">
            <input type="radio" value="fixed" {...register("target.kind")} />
            Fixed coordinates
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" value="ephemeris" {...register("target.kind")} />
            Moving target (ephemeris)
          </label>
        </div>
        <p className="min-h-4" />
      </fieldset>
      {kind === "ephemeris" ? (
        <>
          <EphemerisInput form={form} attach={attachEphemeris} />
          <TextField
            id="request-h"
            label="Absolute magnitude H"
            inputMode="decimal"
            autoComplete="off"
            hint="Optional: drives the fading clock (needs r_au and delta_au)."
            error={errors.target?.hMag?.message}
            {...register("target.hMag")}
          />
          <TextField id="request-g" label="Slope parameter G" inputMode="decimal" autoComplete="off" hint="Optional; 0.15 when unknown." error={errors.target?.gSlope?.message} {...register("target.gSlope")} />
        </>
      ) : (
        <>
          <TextField
            id="request-ra"
            label="Right ascension (J2000)"
            autoComplete="off"
            spellCheck={false}
            placeholder="05:35:17.3"
            hint="Any usual form: 05:35:17.3, 05h35m17.3s, or degrees such as 83.822."
            className="num"
            error={errors.target?.ra?.message}
            {...register("target.ra")}
          />
          <TextField
            id="request-dec"
            label="Declination (J2000)"
            autoComplete="off"
            spellCheck={false}
            placeholder="-05:23:28"
            hint="−05:23:28, −5°23′28″ or −5.391."
            className="num"
            error={errors.target?.dec?.message}
            {...register("target.dec")}
          />
        </>
      )}
    </fieldset>
  );
}
