"use client";

/**
 * Live feasibility beside the form: once the fields that decide observability are valid,
 * the preview is asked of the server (a pause after the last keystroke) and redrawn;
 * the previous answer stays on screen while the next one is computed.
 */
import { useEffect, useMemo, useState } from "react";
import useSWR from "swr";
import { Alert } from "@/components/ui/alert";
import type { FeasibilityReport } from "@/lib/requests/feasibility/types";
import { feasibilityBody } from "@/lib/requests/form-values";
import { feasibilityInputSchema, type RequestFormValues } from "@/lib/requests/schemas";
import { FeasibilityView } from "./feasibility-view";
import { PlanningCaution } from "./planning-caution";
import { useDebounced } from "./use-debounced";

const FIELD_NAMES: Record<string, string> = {
  target: "the target",
  telescopeIds: "the telescopes",
  durationMinutes: "the time needed",
  earliestStart: "the earliest start",
  latestEnd: "the latest end",
  deadline: "the deadline",
  constraints: "the constraints",
  instrumentId: "the instrument",
};

async function fetchReport(body: string): Promise<FeasibilityReport> {
  const response = await fetch("/api/v1/too-requests/feasibility", { method: "POST", headers: { "content-type": "application/json" }, body });
  const answer = (await response.json().catch(() => null)) as (FeasibilityReport & { error?: { message: string; fields?: Record<string, string> } }) | null;
  if (!response.ok || !answer || answer.error) {
    const fields = Object.values(answer?.error?.fields ?? {});
    throw new Error([answer?.error?.message ?? `The preview failed (${response.status}).`, ...fields].join(" "));
  }
  return answer;
}

export function FeasibilityPanel({ values, targetName }: { values: { [K in keyof RequestFormValues]?: unknown }; targetName: string }) {
  const body = useDebounced(JSON.stringify(feasibilityBody(values)), 500);
  // Parsed once per settled body, not on every keystroke (an ephemeris can be long).
  const parsed = useMemo(() => feasibilityInputSchema.safeParse(JSON.parse(body)), [body]);
  const { data, error, isValidating } = useSWR(parsed.success ? body : null, fetchReport, {
    keepPreviousData: true,
    revalidateOnFocus: false,
    shouldRetryOnError: false,
  });

  // While a field is half typed, keep the last good preview on screen, marked as such.
  const [last, setLast] = useState<FeasibilityReport | null>(null);
  useEffect(() => {
    if (data) setLast(data);
  }, [data]);

  const missing = parsed.success
    ? []
    : [...new Set(parsed.error.issues.map((i) => FIELD_NAMES[String(i.path[0])] ?? String(i.path[0])))];

  return (
    <section aria-labelledby="feasibility-heading" className="flex flex-col gap-3 rounded-lg border border-line bg-raised p-4">
      <div className="flex items-baseline justify-between gap-2">
        <h2 id="feasibility-heading" className="font-semibold">
          Feasibility
        </h2>
        <span aria-live="polite" className="text-2xs text-muted">
          {isValidating ? "Updating…" : data ? "Up to date" : ""}
        </span>
      </div>
      {!parsed.success && (
        <p className="text-sm text-muted">
          {last ? "Showing the last complete preview. " : ""}To see the airmass charts and observable windows, complete or correct {new Intl.ListFormat("en-GB", { type: "conjunction" }).format(missing)}.
        </p>
      )}
      {!parsed.success && !last && <PlanningCaution />}
      {!parsed.success && last && <FeasibilityView report={last} targetName={targetName} />}
      {parsed.success && error instanceof Error && <Alert tone="error">{error.message}</Alert>}
      {parsed.success && !data && !error && <p className="text-sm text-muted">Computing the nights…</p>}
      {parsed.success && data && <FeasibilityView report={data} targetName={targetName} />}
    </section>
  );
}
