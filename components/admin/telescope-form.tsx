"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { Controller } from "react-hook-form";
import { CheckboxList, type CheckboxOption } from "@/components/ui/checkbox-list";
import type { ActionResult } from "@/lib/actions/result";
import { emptyTelescopeForm, telescopeSchema, type TelescopeFormValues } from "@/lib/telescopes/schemas";
import { FormInput, FormSelect, type SelectOption } from "./form-controls";
import { FormFooter } from "./form-footer";
import { useEditorForm } from "./use-save-action";

export function TelescopeForm({
  telescopeId,
  initial,
  sites,
  assistants,
  action,
}: {
  /** null: create a new telescope. */
  telescopeId: string | null;
  initial: TelescopeFormValues;
  sites: SelectOption[];
  assistants: CheckboxOption[];
  action: (id: string | null, input: unknown) => Promise<ActionResult>;
}) {
  const { register, control, formState: { errors, isSubmitting }, result, onSubmit } = useEditorForm({
    id: telescopeId,
    initial,
    empty: emptyTelescopeForm,
    resolver: zodResolver(telescopeSchema, undefined, { raw: true }),
    action,
  });
  const number = { type: "number", step: "any" } as const;

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      aria-label={telescopeId ? "Edit the telescope" : "Create a telescope"}
      className="grid gap-x-4 sm:grid-cols-2 lg:grid-cols-4"
    >
      <FormSelect id="telescope-site" label="Site" options={sites} error={errors.siteId?.message} {...register("siteId")} />
      <FormInput id="telescope-code" label="Code" error={errors.code?.message} hint="Short and unique, e.g. AQ41." {...register("code")} />
      <FormInput id="telescope-name" label="Name" error={errors.name?.message} className="sm:col-span-2" {...register("name")} />
      <FormInput id="telescope-aperture" label="Aperture (m)" {...number} error={errors.apertureM?.message} {...register("apertureM")} />
      <FormInput id="telescope-min-altitude" label="Lowest altitude (°)" {...number} error={errors.minAltitudeDeg?.message} {...register("minAltitudeDeg")} />
      <FormInput id="telescope-max-airmass" label="Highest airmass" {...number} error={errors.maxAirmass?.message} hint="1 at the zenith." {...register("maxAirmass")} />
      <FormInput
        id="telescope-sun-avoidance"
        label="Sun avoidance (°)"
        {...number}
        error={errors.sunAvoidanceDeg?.message}
        hint="Never point closer to the Sun."
        {...register("sunAvoidanceDeg")}
      />
      <FormInput
        id="telescope-ha-min"
        label="Hour angle east limit (h)"
        {...number}
        error={errors.hourAngleMinH?.message}
        hint="−12 to 0."
        {...register("hourAngleMinH")}
      />
      <FormInput id="telescope-ha-max" label="Hour angle west limit (h)" {...number} error={errors.hourAngleMaxH?.message} hint="0 to 12." {...register("hourAngleMaxH")} />
      <FormInput id="telescope-setup" label="Setup (min)" type="number" step="1" error={errors.setupMinutes?.message} hint="Slew and set-up before a block." {...register("setupMinutes")} />
      <Controller
        control={control}
        name="assistantUserIds"
        render={({ field, fieldState }) => (
          <CheckboxList
            legend="Night assistants"
            options={assistants}
            value={field.value}
            onChange={field.onChange}
            error={fieldState.error?.message}
            empty="No one holds the night assistant role yet."
            className="col-span-full"
          />
        )}
      />
      <FormFooter submitLabel={telescopeId ? "Save telescope" : "Create telescope"} pending={isSubmitting} result={result} />
    </form>
  );
}
