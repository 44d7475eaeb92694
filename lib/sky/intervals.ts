// Time intervals [start, end] in epoch ms, and the ways windows are cut out of a night:
// closed forms for angles that grow linearly in time (hour angle), bisection for smooth
// functions sampled coarsely, and linear interpolation for finely sampled ones.

import { TWO_PI } from "./angles";
import type { Instant } from "./time-scales";

export interface Interval {
  start: Instant;
  end: Instant;
}

export function intersectIntervals(a: readonly Interval[], b: readonly Interval[]): Interval[] {
  const out: Interval[] = [];
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const x = a[i]!;
    const y = b[j]!;
    const start = Math.max(x.start, y.start);
    const end = Math.min(x.end, y.end);
    if (end > start) out.push({ start, end });
    if (x.end < y.end) i++;
    else j++;
  }
  return out;
}

export function clipIntervals(a: readonly Interval[], start: Instant, end: Instant): Interval[] {
  return intersectIntervals(a, [{ start, end }]);
}

export function totalDuration(a: readonly Interval[]): number {
  return a.reduce((sum, x) => sum + (x.end - x.start), 0);
}

/** Intervals within [t0, t1] where an angle φ(t) = φ0 + rate·(t − t0) lies in [lo, hi]
 * modulo 2π (lo < hi, hi − lo ≤ 2π). Exact: the hour angle is linear in time. */
export function phaseBandIntervals(
  phase0: number,
  rate: number,
  t0: Instant,
  t1: Instant,
  lo: number,
  hi: number,
): Interval[] {
  if (hi - lo >= TWO_PI) return [{ start: t0, end: t1 }];
  const out: Interval[] = [];
  const phase1 = phase0 + rate * (t1 - t0);
  let k = Math.floor((phase0 - hi) / TWO_PI);
  for (; lo + k * TWO_PI <= phase1; k++) {
    const a = t0 + (lo + k * TWO_PI - phase0) / rate;
    const b = t0 + (hi + k * TWO_PI - phase0) / rate;
    const start = Math.max(a, t0);
    const end = Math.min(b, t1);
    if (end > start) out.push({ start, end });
  }
  return out;
}

/** Intervals within [t0, t1] where a smooth f(t) ≥ 0: sampled every `stepMs`, sign changes
 * refined by bisection to `toleranceMs`. A dip shorter than a step can be missed. */
export function positiveIntervals(
  f: (t: Instant) => number,
  t0: Instant,
  t1: Instant,
  stepMs: number,
  toleranceMs = 1000,
): Interval[] {
  if (!(t1 > t0)) return [];
  const n = Math.max(1, Math.ceil((t1 - t0) / stepMs));
  const h = (t1 - t0) / n;
  const out: Interval[] = [];
  let prevT = t0;
  let prevOk = f(t0) >= 0;
  let openAt: number | null = prevOk ? t0 : null;
  for (let i = 1; i <= n; i++) {
    const t = i === n ? t1 : t0 + i * h;
    const ok = f(t) >= 0;
    if (ok !== prevOk) {
      let a = prevT;
      let b = t;
      while (b - a > toleranceMs) {
        const m = (a + b) / 2;
        if (f(m) >= 0 === prevOk) a = m;
        else b = m;
      }
      const edge = (a + b) / 2;
      if (ok) openAt = edge;
      else if (openAt !== null) {
        if (edge > openAt) out.push({ start: openAt, end: edge });
        openAt = null;
      }
    }
    prevT = t;
    prevOk = ok;
  }
  if (openAt !== null && t1 > openAt) out.push({ start: openAt, end: t1 });
  return out;
}

/** Intervals where finely sampled values are ≥ 0, with crossings placed by linear
 * interpolation between neighbouring samples. */
export function sampledPositiveIntervals(
  times: ArrayLike<number>,
  values: ArrayLike<number>,
  count: number,
): Interval[] {
  const out: Interval[] = [];
  if (count === 0) return out;
  let openAt: number | null = values[0]! >= 0 ? times[0]! : null;
  for (let i = 1; i < count; i++) {
    const v0 = values[i - 1]!;
    const v1 = values[i]!;
    if (v0 >= 0 !== v1 >= 0) {
      const t0 = times[i - 1]!;
      const t1 = times[i]!;
      const edge = t0 + ((t1 - t0) * v0) / (v0 - v1);
      if (v1 >= 0) openAt = edge;
      else if (openAt !== null) {
        if (edge > openAt) out.push({ start: openAt, end: edge });
        openAt = null;
      }
    }
  }
  const last = times[count - 1]!;
  if (openAt !== null && last > openAt) out.push({ start: openAt, end: last });
  return out;
}
