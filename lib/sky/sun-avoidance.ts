// Sun avoidance: pointing near the Sun can destroy instruments and blind people, so every
// night states plainly whether the limit allowed the windows, shortened them or refused.

import { DEG } from "./angles";
import type { EffectiveLimits } from "./constraints";
import { type Interval, totalDuration } from "./intervals";
import type { NightContext } from "./night-context";
import { ONE_SECOND } from "./target-night";
import type { Instant } from "./time-scales";
import type { Vec3 } from "./vectors";

export type SunAvoidanceStatus = "clear" | "restricted" | "refused";

export interface SunAvoidanceVerdict {
  status: SunAvoidanceStatus;
  limitDeg: number;
  /** Closest approach to the Sun while the target is otherwise observable (else during the
   * dark hours, else over the night), degrees; null when no position is known. */
  closestDeg: number | null;
  reason: string;
}

/** Smallest value of f over intervals, sampled every 10 minutes and at both ends; null if
 * f is never finite. */
export function minimumOver(over: readonly Interval[], f: (t: Instant) => number): number | null {
  let best = Infinity;
  for (const iv of over) {
    const n = Math.max(1, Math.ceil((iv.end - iv.start) / 600_000));
    for (let i = 0; i <= n; i++) best = Math.min(best, f(iv.start + ((iv.end - iv.start) * i) / n));
  }
  return Number.isFinite(best) ? best : null;
}

export function sunAvoidanceVerdict(
  ctx: NightContext,
  s: { candidate: Interval[]; afterSun: Interval[]; dark: Interval[] },
  L: EffectiveLimits,
  direction: (t: Instant) => Vec3 | null,
): SunAvoidanceVerdict {
  const sun = new Float64Array(4);
  const over =
    s.candidate.length > 0 ? s.candidate : s.dark.length > 0 ? s.dark : [{ start: ctx.span.start, end: ctx.span.end }];
  const closest = minimumOver(over, (t) => {
    const dir = direction(t);
    if (!dir) return Infinity;
    ctx.tracks.sunAt(t, sun);
    const d = dir[0] * sun[0]! + dir[1] * sun[1]! + dir[2] * sun[2]!;
    return Math.acos(Math.max(-1, Math.min(1, d))) / DEG;
  });
  const limit = L.sunAvoidanceDeg;
  const f = (x: number) => `${x.toFixed(1)}°`;
  if (closest === null) {
    return {
      status: "clear",
      limitDeg: limit,
      closestDeg: null,
      reason: "No target position is known for this night.",
    };
  }
  if (s.candidate.length === 0) {
    return closest >= limit
      ? {
          status: "clear",
          limitDeg: limit,
          closestDeg: closest,
          reason: `Not observable this night for other reasons; it stays at least ${f(closest)} from the Sun (limit ${f(limit)}).`,
        }
      : {
          status: "refused",
          limitDeg: limit,
          closestDeg: closest,
          reason: `Refused for sun avoidance: the target comes within ${f(closest)} of the Sun, inside this telescope's ${f(limit)} limit.`,
        };
  }
  const before = totalDuration(s.candidate);
  const after = totalDuration(s.afterSun);
  if (after <= 0) {
    return {
      status: "refused",
      limitDeg: limit,
      closestDeg: closest,
      reason: `Refused for sun avoidance: whenever the target is otherwise observable it is within ${f(limit)} of the Sun (closest ${f(closest)}).`,
    };
  }
  if (after < before - ONE_SECOND) {
    return {
      status: "restricted",
      limitDeg: limit,
      closestDeg: closest,
      reason: `Windows shortened by ${((before - after) / 60_000).toFixed(0)} min: the target comes within ${f(closest)} of the Sun, inside the ${f(limit)} limit.`,
    };
  }
  return {
    status: "clear",
    limitDeg: limit,
    closestDeg: closest,
    reason: `Stays at least ${f(closest)} from the Sun whenever observable (limit ${f(limit)}).`,
  };
}
