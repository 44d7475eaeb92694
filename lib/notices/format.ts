/**
 * Text pieces shared by the e-mails and the in-app notices: every instant in UT with the
 * site's local time beside it, durations in hours and minutes, ledger hours to 0.1 h.
 */
import { formatDuration, formatLocal, formatUt } from "@/lib/time/format";

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
