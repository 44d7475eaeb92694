import Link from "next/link";
import { TimeRange } from "@/components/time/time-range";
import { Alert } from "@/components/ui/alert";
import { STATE_LABELS } from "@/lib/requests/labels";
import type { RequestState } from "@/db/types";
import type { DecisionRecord } from "@/lib/review/decision-record";
import { formatDuration, formatUt } from "@/lib/time/format";

const VERB = { approve: "Approved", decline: "Declined", return: "Returned to the PI" } as const;

/** A request no longer open for a decision: what was decided, by whom, and where to look next. */
export function DecisionSummary({ state, record, deadline = null }: { state: RequestState; record: DecisionRecord | undefined; deadline?: Date | null }) {
  if (state === "lapsed") {
    return (
      <Alert>
        The PI&apos;s deadline{deadline && <> (<span className="num">{formatUt(deadline)} UT</span>)</>} passed before a decision: the request
        lapsed and will not be scheduled. The PI has been told.
      </Alert>
    );
  }
  if (!record) return <Alert>This request is {STATE_LABELS[state].toLowerCase()}: there is nothing to decide.</Alert>;
  return (
    <section aria-label="Decision" className="flex flex-col gap-2 rounded-lg border border-line bg-raised p-4">
      <h2 className="font-semibold">{VERB[record.decision]}</h2>
      <p className="text-sm">
        {VERB[record.decision]} by {record.decidedBy} at <span className="num">{formatUt(record.decidedAt)} UT</span>.
        {record.note && <> Note: “{record.note}”</>}
      </p>
      {record.slot && (
        <>
          <p className="flex flex-wrap items-baseline gap-2 text-sm">
            Override on <span className="num font-semibold">{record.slot.telescopeCode}</span>
            <TimeRange start={record.slot.start} end={record.slot.end} timeZone={record.slot.timeZone} />
          </p>
          <p className="text-sm">
            {record.displacedMinutes > 0 ? `${formatDuration(record.displacedMinutes)} of scheduled time displaced; the displaced programs are credited on the ledger.` : "No scheduled time was displaced."}
          </p>
          <p className="flex flex-wrap gap-4 text-sm">
            <Link className="underline" href={`/schedule?telescope=${encodeURIComponent(record.slot.telescopeCode)}`}>See it on the schedule</Link>
            <Link className="underline" href={`/tonight/${encodeURIComponent(record.slot.telescopeCode)}`}>Tonight&apos;s queue on {record.slot.telescopeCode}</Link>
            <Link className="underline" href="/ledger">Time-owed ledger</Link>
          </p>
        </>
      )}
    </section>
  );
}
