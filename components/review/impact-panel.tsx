"use client";

/**
 * What the chosen slot would do to the schedule: every block it cuts into (how, by how
 * much, whose), the totals per program and per observer, and what each would be owed.
 */
import { KindBadge } from "@/components/schedule/kind-badge";
import { TimeRange } from "@/components/time/time-range";
import { Alert } from "@/components/ui/alert";
import type { ImpactJson } from "@/lib/impact/json";
import { formatDuration, formatUt } from "@/lib/time/format";

const CHANGE_TEXT = { remove: "given up entirely", "trim-end": "ends early", "trim-start": "starts late", split: "split around the override" } as const;

export function ImpactPanel({ impact, loading, error }: { impact: ImpactJson | undefined; loading: boolean; error: Error | undefined }) {
  return (
    <section aria-labelledby="impact-heading" className="flex flex-col gap-3 rounded-lg border border-line bg-raised p-4">
      <div className="flex items-baseline justify-between gap-2">
        <h2 id="impact-heading" className="font-semibold">Impact of this slot</h2>
        <span aria-live="polite" className="text-2xs text-muted">{loading ? "Updating…" : impact ? "Up to date" : ""}</span>
      </div>
      {error && <Alert tone="error">Could not compute the impact: {error.message}</Alert>}
      {impact && <ImpactBody impact={impact} />}
    </section>
  );
}

function ImpactBody({ impact }: { impact: ImpactJson }) {
  const tz = impact.telescope.timeZone;
  if (!impact.approvable) {
    return (
      <Alert tone="error">
        Another override already holds part of this slot ({impact.blockedBy.map((b) => `${b.programCode}, ${formatUt(new Date(b.start))}–${formatUt(new Date(b.end)).slice(11)} UT`).join("; ")}). An override never displaces another: choose another slot.
      </Alert>
    );
  }
  return (
    <>
      <p className="text-sm" data-testid="impact-summary">
        {impact.blocks.length === 0 ? (
          <>Displaces nothing: the slot is unscheduled time on {impact.telescope.code}.</>
        ) : (
          <>
            Displaces <strong className="num">{formatDuration(impact.displacedMinutes)}</strong> from {impact.byProgram.length} program{impact.byProgram.length === 1 ? "" : "s"} on {impact.telescope.code}; they would be owed{" "}
            <strong className="num">{formatDuration(impact.owedMinutes)}</strong> (credit {impact.creditRatio}:1).
          </>
        )}
      </p>
      {impact.blocks.length > 0 && (
        <div className="scroll-cue overflow-x-auto rounded-md border border-line">
          <table className="w-full text-left text-xs">
            <caption className="sr-only">Blocks the slot would displace</caption>
            <thead className="bg-sunken text-2xs uppercase tracking-wide text-muted">
              <tr>
                <th scope="col" className="px-2 py-1.5 font-medium">Program</th>
                <th scope="col" className="px-2 py-1.5 font-medium">Observer</th>
                <th scope="col" className="px-2 py-1.5 font-medium">Block</th>
                <th scope="col" className="px-2 py-1.5 font-medium">Lost</th>
                <th scope="col" className="px-2 py-1.5 text-right font-medium">Minutes</th>
                <th scope="col" className="px-2 py-1.5 text-right font-medium">Owed</th>
              </tr>
            </thead>
            <tbody>
              {impact.blocks.map((b) => (
                <tr key={b.blockId} className="border-t border-line align-top">
                  <td className="px-2 py-1.5">
                    <span className="num">{b.programCode}</span> <KindBadge kind={b.kind} />
                    <span className="block text-2xs text-muted">rank {b.programRank} · {CHANGE_TEXT[b.change]}</span>
                  </td>
                  <td className="px-2 py-1.5">{b.observerName ?? <span className="text-muted">none</span>}</td>
                  <td className="px-2 py-1.5"><TimeRange start={new Date(b.blockStart)} end={new Date(b.blockEnd)} timeZone={tz} /></td>
                  <td className="px-2 py-1.5"><TimeRange start={new Date(b.lostStart)} end={new Date(b.lostEnd)} timeZone={tz} /></td>
                  <td className="num px-2 py-1.5 text-right">{Math.round(b.minutes)}</td>
                  <td className="num px-2 py-1.5 text-right">{Math.round(b.owedMinutes)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {impact.blocks.length > 0 && (
        <div className="grid gap-3 sm:grid-cols-2">
          <Totals
            caption="Per program"
            rows={impact.byProgram.map((p) => ({ key: p.programId, label: `${p.programCode} (rank ${p.programRank})`, minutes: p.minutes, owed: p.owedMinutes }))}
          />
          <Totals
            caption="Per observer"
            rows={impact.byObserver.map((o) => ({ key: o.observerUserId ?? "none", label: o.observerName ?? "No observer", minutes: o.minutes, owed: o.owedMinutes }))}
          />
        </div>
      )}
    </>
  );
}

function Totals({ caption, rows }: { caption: string; rows: Array<{ key: string; label: string; minutes: number; owed: number }> }) {
  return (
    <table className="w-full text-left text-xs">
      <caption className="mb-1 text-left text-2xs font-semibold uppercase tracking-wide text-muted">{caption}</caption>
      <thead className="sr-only">
        <tr>
          <th scope="col">Who</th>
          <th scope="col">Displaced</th>
          <th scope="col">Owed</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.key} className="border-t border-line">
            <td className="py-1 pr-2">{r.label}</td>
            <td className="num py-1 pr-2 text-right">{formatDuration(r.minutes)}</td>
            <td className="num py-1 text-right text-muted">owed {formatDuration(r.owed)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
