// The Moon as seen from the site during a night: topocentric place (parallax applied by
// vector subtraction), altitude, illuminated fraction and separation from the target; and
// moonrise/moonset from suncalc 2.0.2, whose upper-limb, refraction-corrected convention
// agrees with astronomy-engine within seconds (suncalc-accuracy.test.ts) —
// plenty for a planning display; the Moon constraints themselves use our own positions.

import { getMoonTimes } from "suncalc";
import { DEG } from "./angles";
import { phaseAngle, illuminatedFraction } from "./moon";
import { lastAt, type NightContext } from "./night-context";
import { KM_PER_AU, observerVectorKm, zenithVector } from "./site";
import type { Site } from "./site";
import { type Instant, MS_PER_DAY } from "./time-scales";
import { angleBetween, dot, norm, sub, type Vec3 } from "./vectors";

const mbuf = new Float64Array(3);
const sbuf = new Float64Array(4);

export interface MoonSample {
  altitudeDeg: number;
  /** Topocentric illuminated fraction, 0…1. */
  illumination: number;
  /** Angular distance from the target, degrees (null without a target direction). */
  separationDeg: number | null;
}

/** Topocentric apparent Moon, km, true equator of date. */
export function moonTopocentricKm(ctx: NightContext, t: Instant): Vec3 {
  ctx.tracks.moonAt(t, mbuf);
  return sub([mbuf[0]!, mbuf[1]!, mbuf[2]!], observerVectorKm(ctx.geo, lastAt(ctx, t)));
}

export function moonSample(ctx: NightContext, t: Instant, target: Vec3 | null): MoonSample {
  const m = moonTopocentricKm(ctx, t);
  const last = lastAt(ctx, t);
  const altitudeDeg = Math.asin(dot(m, zenithVector(ctx.geo, last)) / norm(m)) / DEG;
  ctx.tracks.sunAt(t, sbuf);
  const k = sbuf[3]! * KM_PER_AU;
  const sun: Vec3 = [sbuf[0]! * k, sbuf[1]! * k, sbuf[2]! * k];
  return {
    altitudeDeg,
    illumination: illuminatedFraction(phaseAngle(sun, m)),
    separationDeg: target ? angleBetween(m, target) / DEG : null,
  };
}

/** ≥ 0 when the Moon does not spoil the target at t: it is set, or far and dim enough. */
export function moonMargin(
  ctx: NightContext,
  t: Instant,
  target: Vec3,
  minSeparationDeg: number | null,
  maxIllumination: number | null,
): number {
  const s = moonSample(ctx, t, target);
  if (s.altitudeDeg < 0) return -s.altitudeDeg;
  let m = Infinity;
  if (minSeparationDeg !== null) m = Math.min(m, s.separationDeg! - minSeparationDeg);
  if (maxIllumination !== null) m = Math.min(m, (maxIllumination - s.illumination) * 100);
  return Math.max(-s.altitudeDeg, m);
}

/** First moonrise and moonset within [start, end] (suncalc, upper limb, refracted). */
// suncalc's rise/set search is the slowest part of a night's report, and the same for
// every target: keep each site's answer per UT day.
const moonTimesKept = new Map<string, ReturnType<typeof getMoonTimes>>();

function moonTimesOn(day: number, site: Site): ReturnType<typeof getMoonTimes> {
  const key = `${site.latitudeDeg}|${site.longitudeDeg}|${day}`;
  let times = moonTimesKept.get(key);
  if (!times) {
    times = getMoonTimes(new Date(day * MS_PER_DAY), site.latitudeDeg, site.longitudeDeg);
    if (moonTimesKept.size >= 5_000) moonTimesKept.clear();
    moonTimesKept.set(key, times);
  }
  return times;
}

export function moonRiseSet(site: Site, start: Instant, end: Instant): { rise: Instant | null; set: Instant | null } {
  let rise: Instant | null = null;
  let set: Instant | null = null;
  for (let day = Math.floor(start / MS_PER_DAY); day * MS_PER_DAY <= end; day++) {
    const times = moonTimesOn(day, site);
    const r = times.rise?.getTime();
    const s = times.set?.getTime();
    if (rise === null && r !== undefined && r >= start && r <= end) rise = r;
    if (set === null && s !== undefined && s >= start && s <= end) set = s;
  }
  return { rise, set };
}
