"use client";

import { useId, useState } from "react";
import { parseEphemerisCsv, type EphemerisCsvIssue } from "@/lib/requests/ephemeris-csv";
import { formatUt } from "@/lib/time/format";
import type { RequestForm } from "./form-types";

/**
 * The moving target's ephemeris: a CSV read in the browser with the same parser the
 * server trusts, put into the form (so the preview and the autosave see it at once), and
 * kept as an attachment of kind "ephemeris".
 */
export function EphemerisInput({ form, attach, disabled }: { form: RequestForm; attach: (file: File) => Promise<boolean>; disabled?: boolean }) {
  const id = useId();
  const [issues, setIssues] = useState<EphemerisCsvIssue[]>([]);
  const rows = form.watch("target.ephemeris") ?? [];
  const error = form.formState.errors.target?.ephemeris?.message;
  const first = rows[0];
  const last = rows[rows.length - 1];
  const withDistances = rows.length > 0 && rows.every((r) => r.rAu !== undefined && r.deltaAu !== undefined);

  return (
    <div className="flex flex-col gap-1 sm:col-span-2">
      <label htmlFor={id} className="text-xs font-semibold uppercase tracking-wide text-muted">
        Ephemeris table (CSV)
      </label>
      <input
        id={id}
        type="file"
        accept=".csv,.txt,text/csv,text/plain"
        disabled={disabled}
        aria-describedby={`${id}-hint`}
        className="text-sm file:mr-3 file:rounded-md file:border file:border-line file:bg-raised file:px-3 file:py-1.5 file:text-sm"
        onChange={async (e) => {
          const input = e.currentTarget;
          const file = input.files?.[0];
          input.value = "";
          if (!file) return;
          const parsed = parseEphemerisCsv(await file.text());
          setIssues(parsed.issues);
          if (parsed.issues.length > 0) return;
          form.setValue("target.ephemeris", parsed.rows, { shouldDirty: true, shouldValidate: form.formState.isSubmitted });
          await attach(file);
        }}
      />
      <p id={`${id}-hint`} className="text-xs text-muted">
        Columns: <code>utc</code> (ISO 8601, UTC), <code>ra</code>, <code>dec</code> (ICRS, any usual form), and optionally <code>r_au</code>,{" "}
        <code>delta_au</code> (au) and <code>mag</code>. One row per line after a header row.
      </p>
      {first && last && (
        <p role="status" className="num text-xs">
          {rows.length} rows, {formatUt(new Date(first.time))} → {formatUt(new Date(last.time))} UT{withDistances ? ", with r and Δ" : ""}
        </p>
      )}
      {issues.length > 0 && (
        <div role="alert" className="rounded-md border border-danger px-3 py-2 text-xs text-danger">
          <p className="font-semibold">The table was not used:</p>
          <ul className="list-disc pl-4">
            {issues.map((i) => (
              <li key={`${i.row ?? 0}-${i.column ?? ""}-${i.message}`}>{i.message}</li>
            ))}
          </ul>
        </div>
      )}
      <p aria-live="polite" className="min-h-4 text-xs text-danger">
        {error}
      </p>
    </div>
  );
}
