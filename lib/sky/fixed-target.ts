// A fixed target in one night, in closed form: the altitude limits are crossed where
// cos H = (sin h0 − sin φ sin δ)/(cos φ cos δ), and the hour angle grows linearly with time,
// so every limit but the Sun's is an exact interval. The apparent place is computed once a
// night (it moves < 0.2″).

import { DEG, TWO_PI } from "./angles";
import { apparentDirection, catalogueDirection } from "./apparent-place";
import type { EffectiveLimits, FixedTarget } from "./constraints";
import { type Interval, intersectIntervals, phaseBandIntervals, positiveIntervals } from "./intervals";
import { lastAt, type NightContext } from "./night-context";
import { SIDEREAL_RATE } from "./sidereal-time";
import { makeWindow, type ObservableWindow, ONE_SECOND, type TargetNight } from "./target-night";
import type { Instant } from "./time-scales";
import type { Vec3 } from "./vectors";

// Module-local copy: imported bindings can be getter calls, and this is hot.
const RATE = SIDEREAL_RATE;

/** Geocentric apparent direction of a fixed target for the night (true equator of date). */
export function fixedDirection(ctx: NightContext, target: FixedTarget): Vec3 {
  return apparentDirection(ctx.frame, catalogueDirection(target.raDeg * DEG, target.decDeg * DEG, ctx.frame.T, target));
}

export function solveFixedTarget(
  ctx: NightContext,
  target: FixedTarget,
  dark: Interval[],
  L: EffectiveLimits,
): TargetNight {
  const u = fixedDirection(ctx, target);
  const ra = Math.atan2(u[1], u[0]);
  const dec = Math.asin(u[2]);
  const { start, end } = ctx.span;
  const A = ctx.geo.sinLat * Math.sin(dec);
  const B = ctx.geo.cosLat * Math.cos(dec);
  const h0 = lastAt(ctx, start) - ra; // hour angle at the span start, unwrapped
  const sinAlt = (t: Instant) => A + B * Math.cos(h0 + RATE * (t - start));

  let candidate: Interval[] = dark;
  if (L.declination && (dec / DEG < L.declination.min || dec / DEG > L.declination.max)) candidate = [];
  candidate = intersectIntervals(candidate, altitudeBand(A, B, h0, start, end, L.sinMinAltitude, L.sinMaxAltitude));
  if (L.hourAngle) {
    candidate = intersectIntervals(
      candidate,
      phaseBandIntervals(h0, RATE, start, end, L.hourAngle.min, L.hourAngle.max),
    );
  }
  const sun = new Float64Array(4);
  const sunMargin = (t: Instant) => {
    ctx.tracks.sunAt(t, sun);
    return L.cosSunAvoidance - (u[0] * sun[0]! + u[1] * sun[1]! + u[2] * sun[2]!);
  };
  // The Sun moves ~1° a day, so ≤ 0.5° either side of midnight: when the limit is more
  // than a degree away at midnight, its verdict holds all night and nothing needs sampling.
  let afterSun: Interval[] = [];
  if (candidate.length > 0) {
    const margin =
      Math.acos(Math.max(-1, Math.min(1, L.cosSunAvoidance - sunMargin(ctx.mid)))) / DEG - L.sunAvoidanceDeg;
    if (margin > 1) afterSun = candidate;
    else if (margin >= -1) {
      for (const c of candidate)
        afterSun.push(...positiveIntervals(sunMargin, c.start, c.end, 60 * 60_000, ONE_SECOND));
    }
  }

  const best = (w: Interval): ObservableWindow => {
    // Upper culmination inside the window, else the higher end.
    const hs = h0 + RATE * (w.start - start);
    const transit = w.start + (Math.ceil(hs / TWO_PI) * TWO_PI - hs) / RATE;
    let at = transit;
    if (transit > w.end) at = sinAlt(w.start) >= sinAlt(w.end) ? w.start : w.end;
    return makeWindow(w, Math.asin(Math.min(1, sinAlt(at))) / DEG, at);
  };
  return { candidate, afterSun, direction: () => u, best };
}

/** Where sin(altitude) = A + B cos H lies within [sinMin, sinMax], H = h0 + rate·(t − start). */
function altitudeBand(
  A: number,
  B: number,
  h0: number,
  start: Instant,
  end: Instant,
  sinMin: number,
  sinMax: number | null,
): Interval[] {
  const all: Interval[] = [{ start, end }];
  if (B < 1e-12) {
    // Target at a pole or site at a pole: the altitude does not change.
    return A >= sinMin && (sinMax === null || A <= sinMax) ? all : [];
  }
  let out = all;
  const cMin = (sinMin - A) / B;
  if (cMin > 1) return []; // never rises above the limit
  if (cMin > -1) {
    const H = Math.acos(cMin);
    out = phaseBandIntervals(h0, RATE, start, end, -H, H);
  }
  if (sinMax !== null) {
    const cMax = (sinMax - A) / B;
    if (cMax < -1) return []; // always above the highest allowed altitude
    if (cMax < 1) {
      const H = Math.acos(cMax);
      out = intersectIntervals(out, phaseBandIntervals(h0, RATE, start, end, H, TWO_PI - H));
    }
  }
  return out;
}
