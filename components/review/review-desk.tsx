"use client";

/**
 * The decision desk of one request: the slot finder's suggestions, the chosen slot (by
 * suggestion, by the inputs or on the time-grid), its live impact, and the decisions.
 * A slot taken by another override a moment ago comes back as a clear message and the
 * impact is fetched again, so the director sees the schedule as it now stands.
 */
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import type { ActionResult } from "@/lib/actions/result";
import type { CalendarTelescope } from "@/lib/schedule/calendar-queries";
import type { SlotSuggestion } from "@/lib/slot-finder/types";
import { ApproveForm, DeclineForm, ResultMessage, ReturnForm, type DecideAction } from "./decision-forms";
import { ImpactPanel } from "./impact-panel";
import { SlotEditor } from "./slot-editor";
import { SlotGrid } from "./slot-grid";
import { SuggestionList } from "./suggestion-list";
import { useImpact, type SlotChoice } from "./use-impact";

function Panel({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-3 rounded-lg border border-line bg-raised p-4">
      <h2 className="font-semibold">{title}</h2>
      {children}
    </section>
  );
}

export function ReviewDesk({
  requestId,
  telescopes,
  suggestions,
  reason,
  note,
  initialSlot,
  action,
}: {
  requestId: string;
  telescopes: CalendarTelescope[];
  suggestions: SlotSuggestion[];
  reason: string | null;
  /** Why later slots are not offered (the target fades), when some are. */
  note: string | null;
  initialSlot: SlotChoice;
  action: DecideAction;
}) {
  const router = useRouter();
  const [slot, setSlot] = useState<SlotChoice>(initialSlot);
  const [result, setResult] = useState<ActionResult<{ state: string }> | null>(null);
  const [pending, startTransition] = useTransition();
  const impact = useImpact(slot);
  const timeZones = Object.fromEntries(telescopes.map((t) => [t.id, t.timeZone]));
  const telescope = telescopes.find((t) => t.id === slot.telescopeId);

  const choose = (next: SlotChoice) => {
    setResult(null);
    setSlot(next);
  };
  const done = (answer: ActionResult<{ state: string }>) => {
    setResult(answer);
    if (answer.ok) router.refresh();
    else void impact.mutate();
  };
  const approve = (note: string) =>
    startTransition(async () => {
      const answer = await action(requestId, { decision: "approve", telescopeId: slot.telescopeId, start: new Date(slot.start).toISOString(), end: new Date(slot.end).toISOString(), note });
      done(answer);
    });

  return (
    <div className="flex flex-col gap-6">
      <Panel title="Slot finder">
        <SuggestionList suggestions={suggestions} reason={reason} note={note} timeZones={timeZones} chosen={slot} onUse={(s: SlotSuggestion) => choose({ telescopeId: s.telescopeId, start: s.start, end: s.end })} />
      </Panel>
      <Panel title="Chosen slot">
        <SlotEditor slot={slot} telescopes={telescopes} onChange={choose} />
        <SlotGrid slot={slot} telescope={telescope} onChange={choose} />
      </Panel>
      <ImpactPanel impact={impact.data} loading={impact.isValidating} error={impact.error instanceof Error ? impact.error : undefined} />
      <Panel title="Decision">
        <ResultMessage result={result} />
        <ApproveForm disabled={slot.end <= slot.start || impact.data?.approvable === false} pending={pending} onApprove={approve} />
        <div className="grid gap-4 border-t border-line pt-3 sm:grid-cols-2">
          <DeclineForm requestId={requestId} action={action} onDone={done} />
          <ReturnForm requestId={requestId} action={action} onDone={done} />
        </div>
      </Panel>
    </div>
  );
}
