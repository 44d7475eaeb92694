/**
 * Text pieces shared by the e-mails and the in-app notices: every instant in UT with the
 * site's local time beside it, durations in hours and minutes, ledger hours to 0.1 h.
 */
import { formatDuration, formatLocal, formatUt } from "@/lib/time/format";
import type { OutcomeLoggedPayload, RequestLapsedPayload } from "./events";

export function utAndLocal(at: Date, timeZone: string): string {
  return `${formatUt(at)} UT (${formatLocal(at, timeZone)})`;
}

/** "2026-12-01 23:10–01:40 UT (20:10–22:40 GMT-3)"; the date is repeated when it changes. */
export function rangeUtAndLocal(start: Date, end: Date, timeZone: string): string {
  const us = formatUt(start);
  const ue = formatUt(end);
  const ls = formatLocal(start, timeZone);
  const le = formatLocal(end, timeZone);
  const utEnd = us.slice(0, 10) === ue.slice(0, 10) ? ue.slice(11) : ue;
  const localEnd = ls.slice(0, 10) === le.slice(0, 10) ? le.slice(11) : le;
  return `${us}–${utEnd} UT (${ls.slice(0, 16)}–${localEnd})`;
}

export function minutesBetween(start: Date, end: Date): number {
  return Math.round((end.getTime() - start.getTime()) / 60_000);
}

export { formatDuration };

export function formatHours(hours: number): string {
  return `${(Math.round(hours * 10) / 10).toFixed(1)} h`;
}

export const URGENCY_LABELS = { now: "now (interrupt the current block)", tonight: "tonight", within_days: "within days" } as const;

/** A logged outcome in the words of a notice. */
export const OUTCOME_WORDS: Record<OutcomeLoggedPayload["outcome"], string> = {
  executed: "executed",
  partial: "partially executed",
  aborted: "aborted",
  weather: "lost to weather",
  technical: "lost to a technical fault",
};

export const SETTLED_STATE_WORDS: Record<OutcomeLoggedPayload["requestState"], string> = {
  executed: "executed",
  partially_executed: "partially executed",
  not_executed: "not executed",
};

/** "Your override for X on AQ41 was lost to weather; nothing was observed." */
export function outcomeSentence(p: OutcomeLoggedPayload): string {
  const what = `Your override for ${p.targetName} on ${p.telescope.code}`;
  const used = p.minutesUsed;
  switch (p.outcome) {
    case "executed":
      return used ? `${what} was observed: ${formatDuration(used)} on sky.` : `${what} was observed.`;
    case "partial": {
      const blockMinutes = minutesBetween(p.block.startsAt, p.block.endsAt);
      return used
        ? `${what} was partly observed: ${formatDuration(used)} of the ${formatDuration(blockMinutes)} block.`
        : `${what} was partly observed.`;
    }
    case "aborted":
    case "weather":
    case "technical":
      return used
        ? `${what} was ${OUTCOME_WORDS[p.outcome]} after ${formatDuration(used)} on sky; the request is recorded as not executed.`
        : `${what} was ${OUTCOME_WORDS[p.outcome]}; nothing was observed.`;
  }
}

/** Where a lapsed request was when its deadline passed, as a clause: "while it was … ". */
export const AWAITING_WORDS: Record<RequestLapsedPayload["fromState"], string> = {
  submitted: "waiting in the review queue",
  in_review: "in review",
};

/** "The deadline 2026-12-03 12:00 UT (… GMT-3) passed while the request was in review; no director decided it." */
export function lapseSentence(p: RequestLapsedPayload): string {
  return `The deadline ${utAndLocal(p.deadline, p.site.timeZone)} passed while the request was ${AWAITING_WORDS[p.fromState]}, before a director decided it.`;
}
