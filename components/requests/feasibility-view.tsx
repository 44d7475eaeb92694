"use client";

/**
 * A feasibility report, read: the verdict with its reasons, then per acceptable telescope
 * an airmass chart of the coming nights (pick the night) and the window's nights in a
 * table, then the fading clock for a moving target. Planning aid: the caution stays on top.
 */
import { useEffect, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { cn } from "@/lib/cn";
import type { FeasibilityReport, TelescopeFeasibility } from "@/lib/requests/feasibility/types";
import { formatUt } from "@/lib/time/format";
import { AirmassChart, ChartKey } from "./airmass-chart";
import { FadingClock } from "./fading-clock";
import { NightTable } from "./night-table";
import { PlanningCaution } from "./planning-caution";

const VERDICT_TEXT = { feasible: "Feasible", no_window: "No window", sun_refused: "Refused: sun avoidance" } as const;

/** Chart text follows the theme: read the muted text colour once mounted. */
function useMutedColour(): string | undefined {
  const [colour, setColour] = useState<string>();
  useEffect(() => {
    const value = getComputedStyle(document.documentElement).getPropertyValue("--text-muted").trim();
    if (value) setColour(value);
  }, []);
  return colour;
}

function TelescopeSection({ telescope, report, targetName }: { telescope: TelescopeFeasibility; report: FeasibilityReport; targetName: string }) {
  const sky = report.skies.find((s) => s.siteId === telescope.siteId);
  const nights = sky?.nights ?? [];
  // Open on the first charted night with a window for this telescope.
  const firstUseful = nights.findIndex((n) => telescope.nights.some((tn) => tn.nightOf === n.nightOf && tn.windows.length > 0));
  const [chosen, setChosen] = useState(Math.max(0, firstUseful));
  const night = nights[Math.min(chosen, nights.length - 1)];
  const windows = telescope.nights.find((n) => n.nightOf === night?.nightOf)?.windows ?? [];
  const colour = useMutedColour();
  return (
    <section aria-labelledby={`feasibility-${telescope.telescopeId}`} className="flex flex-col gap-2 rounded-md border border-line p-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`feasibility-${telescope.telescopeId}`} className="text-sm font-semibold">
          {telescope.code} — {telescope.name} <span className="font-normal text-muted">({telescope.siteName})</span>
        </h3>
        <span
          className={cn(
            "rounded-full border px-2 py-0.5 text-2xs font-semibold uppercase tracking-wide",
            telescope.verdict === "feasible" ? "border-ok text-ok" : telescope.verdict === "sun_refused" ? "border-danger text-danger" : "border-line text-muted",
          )}
        >
          {VERDICT_TEXT[telescope.verdict]}
        </span>
      </div>
      <p className="text-xs">{telescope.reason}</p>
      <p className="num text-2xs text-muted">
        Airmass ≤ {telescope.airmassLimit.toFixed(2)} (altitude ≥ {telescope.minAltitudeDeg.toFixed(1)}°) · sun avoidance {telescope.sunAvoidanceDeg}° ·{" "}
        {telescope.sunAvoidance.reason}
      </p>
      {night ? (
        <figure className="flex flex-col gap-1">
          {nights.length > 1 && (
            <div role="group" aria-label={`Night shown for ${telescope.code}`} className="flex flex-wrap gap-1">
              {nights.map((n, i) => (
                <button
                  key={n.nightOf}
                  type="button"
                  aria-pressed={n.nightOf === night.nightOf}
                  onClick={() => setChosen(i)}
                  className={cn("num rounded-md border px-2 py-0.5 text-2xs", n.nightOf === night.nightOf ? "border-text bg-sunken font-semibold" : "border-line text-muted")}
                >
                  Night of {n.nightOf}
                </button>
              ))}
            </div>
          )}
          <AirmassChart sky={night} windows={windows} airmassLimit={telescope.airmassLimit} targetName={targetName} telescopeCode={telescope.code} textColour={colour} />
          <figcaption>
            <ChartKey />
          </figcaption>
        </figure>
      ) : (
        <p className="text-xs text-muted">No night of the window is left to chart.</p>
      )}
      <NightTable telescope={telescope} />
    </section>
  );
}

export function FeasibilityView({ report, targetName }: { report: FeasibilityReport; targetName: string }) {
  const colour = useMutedColour();
  return (
    <div className="flex flex-col gap-3">
      <PlanningCaution />
      {report.verdict === "feasible" ? (
        <Alert tone="ok">Feasible: {report.telescopes.find((t) => t.verdict === "feasible")?.reason}</Alert>
      ) : (
        <div role="alert" className="rounded-md border border-danger px-3 py-2 text-sm text-danger">
          <p className="font-semibold">This request would be refused:</p>
          <ul className="mt-1 list-disc pl-5">
            {report.reasons.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        </div>
      )}
      <p className="num text-2xs text-muted">
        Looking from {formatUt(new Date(report.horizon.start))} to {formatUt(new Date(report.horizon.end))} UT for {report.durationMinutes} min · computed{" "}
        {formatUt(new Date(report.computedAt))} UT
      </p>
      {report.notes.map((note) => (
        <Alert key={note} tone="caution">
          {note}
        </Alert>
      ))}
      {report.telescopes.map((t) => (
        <TelescopeSection key={t.telescopeId} telescope={t} report={report} targetName={targetName} />
      ))}
      {report.fading && <FadingClock fading={report.fading} textColour={colour} />}
    </div>
  );
}
