/**
 * Live figures for the block on sky: the target's altitude and airmass now, and how long
 * until it passes the telescope's limit (the stricter of its airmass and altitude limits)
 * or dawn for the request's darkness, whichever comes first. Pure; runs anywhere.
 *
 * Altitudes are geometric (no refraction), as the sky engine's limits are. A moving
 * target is taken from its geocentric ephemeris; its topocentric parallax (well under a
 * degree unless it passes closer than ~0.01 au) is ignored for these planning figures.
 */
import {
  airmassKastenYoung,
  altitudeForAirmass,
  Ephemeris,
  fixedTargetPosition,
  horizontalPosition,
  type Instant,
  type Site,
} from "@/lib/sky";
import type { OnSkyFigures, OnSkyLimit } from "./types";

export type OnSkyTarget = { kind: "fixed"; raDeg: number; decDeg: number } | { kind: "ephemeris"; ephemeris: Ephemeris };

export interface OnSkyInput {
  target: OnSkyTarget;
  site: Site;
  telescope: { maxAirmass: number; minAltitudeDeg: number };
  /** When the observation must end for darkness (null: the night's end). */
  dawn: Instant | null;
  nightEnd: Instant;
  now: Instant;
}

const STEP_MS = 5 * 60_000;
const PRECISION_MS = 10_000;

/** Altitude (degrees) at t, or null where an ephemeris does not reach. */
function altitudeFunction(target: OnSkyTarget, site: Site, now: Instant): (t: Instant) => number | null {
  if (target.kind === "fixed") {
    // One apparent place for the whole scan: it moves < 0.2″ in a night.
    const place = fixedTargetPosition(target.raDeg, target.decDeg, site, now);
    return (t) => horizontalPosition(place.raDeg, place.decDeg, site, t).altitudeDeg;
  }
  const { ephemeris } = target;
  return (t) => {
    const sample = ephemeris.at(t);
    return sample ? fixedTargetPosition(sample.raDeg, sample.decDeg, site, t).altitudeDeg : null;
  };
}

export function onSkyFigures(input: OnSkyInput): OnSkyFigures | null {
  const { site, telescope, now } = input;
  const altitudeAt = altitudeFunction(input.target, site, now);
  const altitudeNow = altitudeAt(now);
  if (altitudeNow === null) return null;

  const airmassAltitude = altitudeForAirmass(telescope.maxAirmass);
  const limitAltitude = Math.max(airmassAltitude, telescope.minAltitudeDeg);
  const limitKind: OnSkyLimit = airmassAltitude >= telescope.minAltitudeDeg ? "airmass" : "altitude";
  const end = input.dawn ?? input.nightEnd;
  const airmass = airmassKastenYoung(altitudeNow);

  const answer = (limit: OnSkyLimit, until: Instant, beyond = false): OnSkyFigures => ({
    altitudeDeg: altitudeNow,
    airmass,
    limit,
    until: new Date(until).toISOString(),
    minutesLeft: Math.max(0, Math.floor((until - now) / 60_000)),
    beyondLimitNow: beyond,
  });

  if (altitudeNow < limitAltitude) return answer(limitKind, now, true);
  if (now >= end) return answer("dawn", now);

  // Walk forward in strides, then bisect the first stride that crosses the limit.
  let previous = now;
  for (let t = Math.min(now + STEP_MS, end); ; t = Math.min(t + STEP_MS, end)) {
    const alt = altitudeAt(t);
    if (alt === null) return answer("ephemeris_end", bisect(previous, t, (x) => altitudeAt(x) !== null));
    if (alt < limitAltitude) return answer(limitKind, bisect(previous, t, (x) => (altitudeAt(x) ?? -90) >= limitAltitude));
    if (t >= end) return answer("dawn", end);
    previous = t;
  }
}

/** Last instant in [good, bad) where ok() holds, to within PRECISION_MS. */
function bisect(good: Instant, bad: Instant, ok: (t: Instant) => boolean): Instant {
  let lo = good;
  let hi = bad;
  while (hi - lo > PRECISION_MS) {
    const mid = (lo + hi) / 2;
    if (ok(mid)) lo = mid;
    else hi = mid;
  }
  return lo;
}
