/**
 * The director's queue, ordered and summarised, pure: most urgent first — urgency tier
 * (`now`, `tonight`, `within_days`), then the earlier deadline, then the sooner next
 * observable window (from the feasibility check stored when the request was filed).
 */
import type { RequestState, RequestUrgency } from "@/db/types";
import type { FeasibilitySnapshot } from "@/lib/requests/feasibility/types";
import { formatLead } from "@/lib/slot-finder/explain";
import { formatUt } from "@/lib/time/format";

export interface QueueRequest {
  id: string;
  state: RequestState;
  targetName: string;
  piName: string;
  programCode: string | null;
  urgency: RequestUrgency | null;
  deadline: Date | null;
  submittedAt: Date | null;
  durationMinutes: number | null;
  telescopeCodes: string[];
  feasibility: FeasibilitySnapshot | null;
}

export interface NextWindow {
  telescopeCode: string;
  start: number;
  end: number;
  bestAirmass: number | null;
}

export interface QueueItem extends Omit<QueueRequest, "feasibility"> {
  nextWindow: NextWindow | null;
  summary: string;
}

const TIER: Record<RequestUrgency, number> = { now: 0, tonight: 1, within_days: 2 };

/** The first stored window that still has room for the request after `now`. */
export function nextWindowOf(snapshot: FeasibilitySnapshot | null, now: number, durationMinutes: number | null): NextWindow | null {
  if (!snapshot) return null;
  const need = (durationMinutes ?? 0) * 60_000;
  // Checks stored before windows were cut at the fading clock may still hold later ones.
  const fade = snapshot.fading?.alreadyFainter ? -Infinity : snapshot.fading?.fainterThanLimitAt ? Date.parse(snapshot.fading.fainterThanLimitAt) : Infinity;
  let best: NextWindow | null = null;
  for (const telescope of snapshot.telescopes) {
    for (const night of telescope.nights) {
      for (const w of night.windows) {
        const start = Date.parse(w.start);
        const end = Math.min(Date.parse(w.end), fade);
        if (end - Math.max(start, now) < need || end <= now) continue;
        if (!best || Math.max(start, now) < Math.max(best.start, now)) best = { telescopeCode: telescope.code, start, end, bestAirmass: w.bestAirmass };
      }
    }
  }
  return best;
}

export function feasibilitySummary(snapshot: FeasibilitySnapshot | null, next: NextWindow | null, now: number): string {
  if (!snapshot) return "Feasibility was not checked when the request was filed.";
  if (!next) {
    const fading = snapshot.fading;
    if (fading?.alreadyFainter) return "The target was already fainter than the instrument's limit when the request was filed.";
    if (fading?.fainterThanLimitAt && Date.parse(fading.fainterThanLimitAt) <= now) return `The target has faded past the instrument's limit (predicted at ${formatUt(new Date(fading.fainterThanLimitAt))} UT).`;
    return "No observable window long enough is left before the deadline.";
  }
  const airmass = next.bestAirmass === null ? "" : `, best airmass ${next.bestAirmass.toFixed(2)}`;
  if (next.start <= now) return `Observable now on ${next.telescopeCode} until ${formatUt(new Date(next.end)).slice(11)} UT${airmass}.`;
  return `Next window on ${next.telescopeCode} in ${formatLead((next.start - now) / 60_000)} (${formatUt(new Date(next.start))} UT${airmass}).`;
}

function compareQueue(a: QueueItem, b: QueueItem, now: number): number {
  const tier = (x: QueueItem) => (x.urgency ? TIER[x.urgency] : 3);
  const deadline = (x: QueueItem) => x.deadline?.getTime() ?? Infinity;
  const wait = (x: QueueItem) => (x.nextWindow ? Math.max(0, x.nextWindow.start - now) : Infinity);
  return tier(a) - tier(b) || deadline(a) - deadline(b) || wait(a) - wait(b) || (a.submittedAt?.getTime() ?? 0) - (b.submittedAt?.getTime() ?? 0);
}

export function orderQueue(requests: readonly QueueRequest[], now: number): QueueItem[] {
  return requests
    .map(({ feasibility, ...r }) => {
      const nextWindow = nextWindowOf(feasibility, now, r.durationMinutes);
      return { ...r, nextWindow, summary: feasibilitySummary(feasibility, nextWindow, now) };
    })
    .sort((a, b) => compareQueue(a, b, now));
}
