"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useState } from "react";
import type { ActionResult } from "@/lib/actions/result";
import { emptySiteForm, siteSchema, type SiteFormValues } from "@/lib/sites/schemas";
import { listTimeZones } from "@/lib/sites/time-zone";
import { FormInput } from "./form-controls";
import { FormFooter } from "./form-footer";
import { useEditorForm } from "./use-save-action";

// Suggestions only: the browser's list may differ from the server's, which decides.
function useTimeZoneSuggestions(): string[] {
  const [zones, setZones] = useState<string[]>([]);
  useEffect(() => setZones(listTimeZones()), []);
  return zones;
}

export function SiteForm({
  siteId,
  initial,
  action,
}: {
  /** null: create a new site. */
  siteId: string | null;
  initial: SiteFormValues;
  action: (id: string | null, input: unknown) => Promise<ActionResult>;
}) {
  const { register, formState: { errors, isSubmitting }, result, onSubmit } = useEditorForm({
    id: siteId,
    initial,
    empty: emptySiteForm,
    resolver: zodResolver(siteSchema, undefined, { raw: true }),
    action,
  });
  const zones = useTimeZoneSuggestions();

  return (
    <form onSubmit={onSubmit} noValidate aria-label={siteId ? "Edit the site" : "Create a site"} className="grid gap-x-4 sm:grid-cols-2 lg:grid-cols-3">
      <FormInput id="site-code" label="Code" error={errors.code?.message} hint="Short and unique, e.g. AQS." {...register("code")} />
      <FormInput id="site-name" label="Name" error={errors.name?.message} className="lg:col-span-2" {...register("name")} />
      <FormInput id="site-latitude" label="Latitude (°)" type="number" step="any" error={errors.latitudeDeg?.message} hint="North positive, −90 to 90." {...register("latitudeDeg")} />
      <FormInput
        id="site-longitude"
        label="East longitude (°)"
        type="number"
        step="any"
        error={errors.longitudeDeg?.message}
        hint="East positive, west negative."
        {...register("longitudeDeg")}
      />
      <FormInput id="site-height" label="Height (m)" type="number" step="any" error={errors.heightM?.message} hint="Above sea level." {...register("heightM")} />
      <FormInput
        id="site-time-zone"
        label="Time zone"
        list="site-time-zones"
        autoComplete="off"
        error={errors.timeZone?.message}
        hint="IANA name, e.g. America/Santiago."
        {...register("timeZone")}
      />
      <datalist id="site-time-zones">
        {zones.map((z) => (
          <option key={z} value={z} />
        ))}
      </datalist>
      <FormFooter submitLabel={siteId ? "Save site" : "Create site"} pending={isSubmitting} result={result} />
    </form>
  );
}
