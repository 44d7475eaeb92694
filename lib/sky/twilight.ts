// The Sun through a night: sunset/sunrise (Sun's centre at −0.833°: 34′ of horizon
// refraction plus 16′ of semidiameter, sea-level horizon, no dip — an observatory's own
// horizon and altitude limit matter more than the dip), and civil, nautical and
// astronomical twilight (centre at −6°, −12°, −18°, geometric, no refraction, no dip:
// the definitions). Altitudes are topocentric (the Sun's 8.8″ parallax is applied). An event that does not happen in a night is null — polar summer and
// winter, or high-latitude summer nights where astronomical twilight never ends.
//
// Method: closed-form hour angle of each threshold at the Sun's declination, iterated
// with the Sun's motion (Meeus ch. 15 style), then a coarse sampled check; the rare
// inconsistent case falls back to bisection.

import { ARCSEC, DEG, TWO_PI, wrapPi } from "./angles";
import { type Interval, positiveIntervals } from "./intervals";
import { createNightContext, lastAt, type NightContext } from "./night-context";
import { nightSpan } from "./nights";
import type { Site } from "./site";
import { type Instant, MS_PER_DAY } from "./time-scales";
import { sharedSkyTracks, type SkyTracks } from "./tracks";

export type Darkness = "civil" | "nautical" | "astronomical";

/** Sun-centre altitude (degrees) that ends each darkness level. */
export const DARKNESS_SUN_ALTITUDE: Record<Darkness, number> = { civil: -6, nautical: -12, astronomical: -18 };
export const SUNRISE_SUNSET_ALTITUDE = -0.833;

/** Rate of the Sun's hour angle, radians per ms (one solar day per turn). */
const SOLAR_RATE = TWO_PI / MS_PER_DAY;
const buf = new Float64Array(4);

/** The Sun's horizontal parallax, radians (8.794″ at 1 au): it lowers the Sun by p·cos h. */
const SUN_PARALLAX = 8.794 * ARCSEC;

/** sin(altitude) of the Sun's centre as seen from the site (geocentric place, then the
 * 8.8″ parallax, first order). */
export function sunSinAltitude(ctx: NightContext, t: Instant): number {
  ctx.tracks.sunAt(t, buf);
  const last = lastAt(ctx, t);
  const s = ctx.geo.cosLat * (Math.cos(last) * buf[0]! + Math.sin(last) * buf[1]!) + ctx.geo.sinLat * buf[2]!;
  return s - (SUN_PARALLAX / buf[3]!) * (1 - s * s);
}

function sunHourAngle(ctx: NightContext, t: Instant): { ha: number; dec: number } {
  ctx.tracks.sunAt(t, buf);
  const ra = Math.atan2(buf[1]!, buf[0]!);
  return { ha: wrapPi(lastAt(ctx, t) - ra), dec: Math.asin(Math.max(-1, Math.min(1, buf[2]!))) };
}

/** Instant of the Sun's lower culmination (solar midnight) within the night. */
export function solarMidnight(ctx: NightContext): Instant {
  let t = ctx.mid;
  for (let i = 0; i < 3; i++) t += wrapPi(Math.PI - sunHourAngle(ctx, t).ha) / SOLAR_RATE;
  return t;
}

type Crossing = { kind: "event"; time: Instant; cosH: number } | { kind: "above" } | { kind: "below" };

/** When the Sun's centre crosses altitude h0 before (dusk) or after (dawn) solar midnight. */
function crossing(ctx: NightContext, h0: number, side: -1 | 1, midnight: Instant): Crossing {
  const { sinLat, cosLat } = ctx.geo;
  if (cosLat < 1e-9) return { kind: "below" }; // pole: resolved by the sampled check
  let t = midnight;
  let c = 0;
  for (let i = 0; i < 6; i++) {
    const { ha, dec } = sunHourAngle(ctx, t);
    c = (Math.sin(h0) - sinLat * Math.sin(dec)) / (cosLat * Math.cos(dec));
    if (c >= 1) return { kind: "below" };
    if (c <= -1) return { kind: "above" };
    const h0Angle = Math.acos(c);
    const target = side < 0 ? h0Angle : -h0Angle;
    const dt = wrapPi(target - ha) / SOLAR_RATE;
    t += dt;
    if (Math.abs(dt) < 20) break;
  }
  return { kind: "event", time: t, cosH: c };
}

export interface SunBelow {
  /** Where the Sun's centre is at or below the threshold, clipped to the night. */
  intervals: Interval[];
  /** Descending crossing in the night, or null. */
  dusk: Instant | null;
  /** Ascending crossing in the night, or null. */
  dawn: Instant | null;
}

/** Where the Sun is at or below h0Deg during the night of ctx. */
export function sunBelow(ctx: NightContext, h0Deg: number, midnight: Instant = solarMidnight(ctx)): SunBelow {
  const { start, end } = ctx.span;
  // Threshold on the topocentric altitude → threshold on the geocentric one.
  const h0 = h0Deg * DEG + SUN_PARALLAX * Math.cos(h0Deg * DEG);
  const dusk = crossing(ctx, h0, -1, midnight);
  const dawn = crossing(ctx, h0, 1, midnight);
  let intervals: Interval[] | null = null;
  if (dusk.kind === "event" && dawn.kind === "event") {
    const a = Math.max(dusk.time, start);
    const b = Math.min(dawn.time, end);
    intervals = b > a ? [{ start: a, end: b }] : [];
  } else if (dusk.kind === "below" && dawn.kind === "below") intervals = [{ start, end }];
  else if (dusk.kind === "above" && dawn.kind === "above") intervals = [];
  else if (dusk.kind === "event" && dawn.kind === "below") intervals = [{ start: Math.max(dusk.time, start), end }];
  else if (dusk.kind === "below" && dawn.kind === "event") intervals = [{ start, end: Math.min(dawn.time, end) }];

  const sinH0 = Math.sin(h0Deg * DEG);
  // Two clean crossings well away from grazing need no second opinion.
  const clean =
    dusk.kind === "event" && dawn.kind === "event" && Math.abs(dusk.cosH) < 0.95 && Math.abs(dawn.cosH) < 0.95;
  if (intervals === null || (!clean && !consistent(ctx, intervals, sinH0))) {
    intervals = positiveIntervals((t) => sinH0 - sunSinAltitude(ctx, t), start, end, 10 * 60_000, 500);
  }
  const inside = (t: Instant | undefined): t is Instant => t !== undefined && t > start && t < end;
  const first = intervals[0];
  const last = intervals[intervals.length - 1];
  return {
    intervals,
    dusk: inside(first?.start) ? first.start : null,
    dawn: inside(last?.end) ? last.end : null,
  };
}

// Cheap guard: two-hourly samples must agree with the closed-form answer.
function consistent(ctx: NightContext, intervals: Interval[], sinH0: number): boolean {
  const slack = Math.sin(0.02 * DEG);
  for (let t = ctx.span.start; t <= ctx.span.end; t += 2 * 3_600_000) {
    const s = sunSinAltitude(ctx, t);
    const inside = intervals.some((x) => t >= x.start && t <= x.end);
    if (inside ? s > sinH0 + slack : s < sinH0 - slack) return false;
  }
  return true;
}

export interface NightEvents {
  nightOf: string;
  /** The night runs from local mean noon to the next local mean noon. */
  start: Instant;
  end: Instant;
  sunset: Instant | null;
  civilDusk: Instant | null;
  nauticalDusk: Instant | null;
  astronomicalDusk: Instant | null;
  astronomicalDawn: Instant | null;
  nauticalDawn: Instant | null;
  civilDawn: Instant | null;
  sunrise: Instant | null;
  /** Lower culmination of the Sun, and its altitude then (the darkest the night gets). */
  solarMidnight: Instant;
  sunAltitudeAtMidnightDeg: number;
}

export function nightEventsFor(ctx: NightContext): NightEvents {
  const midnight = solarMidnight(ctx);
  const at = (h: number) => sunBelow(ctx, h, midnight);
  const rise = at(SUNRISE_SUNSET_ALTITUDE);
  const civil = at(DARKNESS_SUN_ALTITUDE.civil);
  const nautical = at(DARKNESS_SUN_ALTITUDE.nautical);
  const astro = at(DARKNESS_SUN_ALTITUDE.astronomical);
  return {
    nightOf: ctx.span.nightOf,
    start: ctx.span.start,
    end: ctx.span.end,
    sunset: rise.dusk,
    civilDusk: civil.dusk,
    nauticalDusk: nautical.dusk,
    astronomicalDusk: astro.dusk,
    astronomicalDawn: astro.dawn,
    nauticalDawn: nautical.dawn,
    civilDawn: civil.dawn,
    sunrise: rise.dawn,
    solarMidnight: midnight,
    sunAltitudeAtMidnightDeg: Math.asin(sunSinAltitude(ctx, midnight)) / DEG,
  };
}

/** Sunset, twilight and sunrise for the night of a local date at a site. */
export function nightEvents(site: Site, nightOf: string, tracks: SkyTracks = sharedSkyTracks()): NightEvents {
  return nightEventsFor(createNightContext(site, nightSpan(site, nightOf), tracks));
}
