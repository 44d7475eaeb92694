"use client";

import { TimeRange } from "@/components/time/time-range";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { cn } from "@/lib/cn";
import type { SlotSuggestion } from "@/lib/slot-finder/types";

/** The slot finder's ranked suggestions, each with its one-line reason and a button to take it. */
export function SuggestionList({
  suggestions,
  reason,
  note,
  timeZones,
  chosen,
  onUse,
}: {
  suggestions: SlotSuggestion[];
  reason: string | null;
  note: string | null;
  timeZones: Record<string, string>;
  chosen: { telescopeId: string; start: number; end: number } | null;
  onUse: (s: SlotSuggestion) => void;
}) {
  if (suggestions.length === 0) return <EmptyState>{reason ?? "No slot to suggest."}</EmptyState>;
  return (
    <>
      {note && <p className="text-xs text-muted">{note}</p>}
      <ol aria-label="Suggested slots" className="flex flex-col gap-2">
        {suggestions.map((s, i) => {
          const active = chosen?.telescopeId === s.telescopeId && chosen.start === s.start && chosen.end === s.end;
          return (
            <li key={`${s.telescopeId}-${s.start}`} className={cn("flex flex-wrap items-start gap-3 rounded-md border p-2", active ? "border-flare bg-flare-soft" : "border-line")}>
              <span className="num w-6 shrink-0 pt-0.5 text-right text-muted" aria-hidden="true">{i + 1}.</span>
              <div className="min-w-0 flex-1">
                <p className="flex flex-wrap items-baseline gap-2">
                  <span className="num font-semibold">{s.telescopeCode}</span>
                  <TimeRange start={new Date(s.start)} end={new Date(s.end)} timeZone={timeZones[s.telescopeId] ?? "UTC"} />
                </p>
                <p className="text-xs">{s.explanation}</p>
              </div>
              <Button type="button" variant={active ? "flare" : "quiet"} aria-pressed={active} onClick={() => onUse(s)}>
                Use suggestion {i + 1}
              </Button>
            </li>
          );
        })}
      </ol>
    </>
  );
}
