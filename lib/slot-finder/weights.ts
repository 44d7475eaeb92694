/**
 * What displacing a minute of a block costs, and how the three criteria combine into one
 * score (lower is better), in "rank-weighted minutes":
 *
 * - displacement: minutes × weight, where a rank-1 program weighs 5 and rank 5 weighs 1;
 *   engineering and discretionary time weigh 0.5 (the cheapest time to take); free time 0.
 *   Breaking into a block mid-way adds the setup minutes at that block's weight.
 * - quality: (mean airmass − 1) × 100, so airmass 1.5 counts like 50 minutes of rank 5.
 * - urgency: hours from now × a rate set by the tier — `now` makes every minute of delay
 *   dear, `tonight` moderately, `within_days` cheaply (a day later ≈ 20 min of rank 1).
 */
import type { BlockKind, RequestUrgency } from "@/db/types";

export const CHEAP_TIME_WEIGHT = 0.5;
export const AIRMASS_POINTS = 100;
/** A slot whose airmass is unknown is rated as if at airmass 2. */
export const UNKNOWN_AIRMASS_POINTS = AIRMASS_POINTS;

export const DELAY_POINTS_PER_HOUR: Record<RequestUrgency, number> = {
  now: 600,
  tonight: 20,
  within_days: 4,
};

export function blockWeight(kind: BlockKind, rank: number): number {
  if (kind === "too") return Number.POSITIVE_INFINITY; // never displaced
  if (kind === "engineering" || kind === "discretionary") return CHEAP_TIME_WEIGHT;
  const r = Math.min(5, Math.max(1, Math.round(rank)));
  return 6 - r;
}

export function airmassPoints(airmass: number | null): number {
  return airmass === null ? UNKNOWN_AIRMASS_POINTS : Math.max(0, airmass - 1) * AIRMASS_POINTS;
}

export function delayPoints(urgency: RequestUrgency, start: number, now: number): number {
  return (Math.max(0, start - now) / 3_600_000) * DELAY_POINTS_PER_HOUR[urgency];
}
