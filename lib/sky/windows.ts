// Observable windows: where every constraint holds at once, for one night or many.
//
// Per night the target-independent work is done once (date frame, sidereal time, the
// Sun's crossings); the target is then solved in closed form (fixed-target.ts) or on a
// strided 1-minute grid (moving-target.ts); the Moon's limits are applied by bisection
// inside what is left, and sun avoidance gets its verdict (sun-avoidance.ts).

import { DEG } from "./angles";
import { airmassKastenYoung } from "./airmass";
import {
  effectiveLimits,
  type EffectiveLimits,
  type PlanOptions,
  type RequestConstraints,
  type Target,
  type TelescopeLimits,
} from "./constraints";
import { fixedDirection, solveFixedTarget } from "./fixed-target";
import { horizontalFromHourAngle } from "./horizon";
import { type Interval, positiveIntervals, totalDuration } from "./intervals";
import { moonMargin, moonRiseSet, moonSample } from "./moon-sky";
import { MovingTargetSolver, movingDirection } from "./moving-target";
import { createNightContext, lastAt, type NightContext } from "./night-context";
import { type NightSpan, nightSpan, nightsBetween, nightsFrom } from "./nights";
import { type Site, type SiteGeometry, siteGeometry } from "./site";
import { minimumOver, sunAvoidanceVerdict, type SunAvoidanceVerdict } from "./sun-avoidance";
import { type ObservableWindow, ONE_SECOND } from "./target-night";
import type { Instant } from "./time-scales";
import { sharedSkyTracks } from "./tracks";
import { type NightEvents, nightEventsFor, solarMidnight, sunBelow, sunSinAltitude } from "./twilight";
import type { Vec3 } from "./vectors";

export type { ObservableWindow } from "./target-night";
export type { SunAvoidanceStatus, SunAvoidanceVerdict } from "./sun-avoidance";

export interface PlanRequest {
  site: Site;
  target: Target;
  telescope: TelescopeLimits;
  constraints: RequestConstraints;
  options?: PlanOptions;
}

export interface MoonSummary {
  /** At solar midnight, seen from the site. */
  illumination: number;
  altitudeAtMidnightDeg: number;
  /** Closest approach to the target during the windows (or the dark hours if none), degrees. */
  closestSeparationDeg: number | null;
  rise: Instant | null;
  set: Instant | null;
}

export interface CurvePoint {
  time: Instant;
  altitudeDeg: number | null;
  azimuthDeg: number | null;
  airmass: number | null;
  sunAltitudeDeg: number;
  moonAltitudeDeg: number;
  moonSeparationDeg: number | null;
}

export interface NightSummary {
  nightOf: string;
  start: Instant;
  end: Instant;
  observableMinutes: number;
  windowCount: number;
  bestAltitudeDeg: number | null;
  bestAirmass: number | null;
  bestAt: Instant | null;
}

export interface NightPlan extends NightSummary {
  events: NightEvents;
  /** Where the Sun is below the requested darkness level. */
  dark: Interval[];
  windows: ObservableWindow[];
  sunAvoidance: SunAvoidanceVerdict;
  moon: MoonSummary;
  notes: string[];
}

interface Solved {
  ctx: NightContext;
  midnight: Instant;
  dark: Interval[];
  /** All constraints but the Sun and Moon. */
  candidate: Interval[];
  afterSun: Interval[];
  windows: ObservableWindow[];
  direction: (t: Instant) => Vec3 | null;
  notes: string[];
}

export class Planner {
  readonly limits: EffectiveLimits;
  readonly tracks = sharedSkyTracks();
  private readonly geo: SiteGeometry;
  private readonly stepMs: number;
  private readonly moving: MovingTargetSolver;

  constructor(readonly request: PlanRequest) {
    this.limits = effectiveLimits(request.telescope, request.constraints, request.options);
    this.geo = siteGeometry(request.site);
    const step = request.options?.stepMinutes ?? 1;
    if (!(step > 0 && step <= 60)) throw new RangeError(`stepMinutes must be in (0, 60], got ${step}`);
    this.stepMs = step * 60_000;
    this.moving = new MovingTargetSolver(this.geo, this.limits, this.stepMs);
  }

  summary(span: NightSpan): NightSummary {
    const s = this.solve(span);
    return summarize(span, s.windows);
  }

  night(span: NightSpan): NightPlan {
    const s = this.solve(span);
    const { ctx } = s;
    const events = nightEventsFor(ctx);
    const moonAtMidnight = moonSample(ctx, s.midnight, null);
    const rs = moonRiseSet(this.request.site, span.start, span.end);
    const closestFrom = s.windows.length > 0 ? s.windows : s.dark;
    return {
      ...summarize(span, s.windows),
      events,
      dark: s.dark,
      windows: s.windows,
      sunAvoidance: sunAvoidanceVerdict(ctx, s, this.limits, s.direction),
      moon: {
        illumination: moonAtMidnight.illumination,
        altitudeAtMidnightDeg: moonAtMidnight.altitudeDeg,
        closestSeparationDeg: minimumOver(
          closestFrom,
          (t) => moonSample(ctx, t, s.direction(t)).separationDeg ?? Infinity,
        ),
        rise: rs.rise,
        set: rs.set,
      },
      notes: s.notes,
    };
  }

  /** Target, Sun and Moon sampled every `stepMinutes` over [from, to] (default: the night),
   * for airmass charts. Target fields are null where no position is known. */
  curve(span: NightSpan, stepMinutes: number, from: Instant = span.start, to: Instant = span.end): CurvePoint[] {
    const ctx = createNightContext(this.request.site, span, this.tracks, this.geo);
    const target = this.request.target;
    const fixed = target.kind === "fixed" ? fixedDirection(ctx, target) : null;
    const points: CurvePoint[] = [];
    const step = stepMinutes * 60_000;
    for (let t = from; t <= to + 1; t += step) {
      const dir = target.kind === "fixed" ? fixed : movingDirection(ctx, target.ephemeris, t);
      const last = lastAt(ctx, t);
      let altitudeDeg: number | null = null;
      let azimuthDeg: number | null = null;
      if (dir) {
        const { alt, az } = horizontalFromHourAngle(last - Math.atan2(dir[1], dir[0]), Math.asin(dir[2]), ctx.geo.lat);
        altitudeDeg = alt / DEG;
        azimuthDeg = az / DEG;
      }
      const moon = moonSample(ctx, t, dir);
      points.push({
        time: t,
        altitudeDeg,
        azimuthDeg,
        airmass: altitudeDeg === null ? null : airmassKastenYoung(altitudeDeg),
        sunAltitudeDeg: Math.asin(Math.max(-1, Math.min(1, sunSinAltitude(ctx, t)))) / DEG,
        moonAltitudeDeg: moon.altitudeDeg,
        moonSeparationDeg: moon.separationDeg,
      });
    }
    return points;
  }

  private solve(span: NightSpan): Solved {
    const ctx = createNightContext(this.request.site, span, this.tracks, this.geo);
    const midnight = solarMidnight(ctx);
    const dark = sunBelow(ctx, this.limits.darknessSunAltitudeDeg, midnight).intervals;
    const target = this.request.target;
    const notes: string[] = [];
    const solved =
      target.kind === "fixed"
        ? solveFixedTarget(ctx, target, dark, this.limits)
        : this.moving.solve(ctx, target.ephemeris, dark, notes);
    let windows = solved.afterSun;
    const { minMoonSeparationDeg: minSep, maxMoonIllumination: maxIllum } = this.limits;
    if (windows.length > 0 && (minSep !== null || maxIllum !== null)) {
      const moonOk: Interval[] = [];
      for (const w of windows) {
        moonOk.push(
          ...positiveIntervals(
            (t) => {
              const dir = solved.direction(t);
              return dir ? moonMargin(ctx, t, dir, minSep, maxIllum) : -1;
            },
            w.start,
            w.end,
            20 * 60_000,
            ONE_SECOND,
          ),
        );
      }
      windows = moonOk;
    }
    windows = windows.filter((w) => w.end - w.start >= Math.max(this.limits.minWindowMs, 1));
    return {
      ctx,
      midnight,
      dark,
      candidate: solved.candidate,
      afterSun: solved.afterSun,
      windows: windows.map((w) => solved.best(w)),
      direction: solved.direction,
      notes,
    };
  }
}

function summarize(span: NightSpan, windows: ObservableWindow[]): NightSummary {
  let best: ObservableWindow | null = null;
  for (const w of windows) if (!best || w.bestAltitudeDeg > best.bestAltitudeDeg) best = w;
  return {
    nightOf: span.nightOf,
    start: span.start,
    end: span.end,
    observableMinutes: totalDuration(windows) / 60_000,
    windowCount: windows.length,
    bestAltitudeDeg: best ? best.bestAltitudeDeg : null,
    bestAirmass: best ? best.bestAirmass : null,
    bestAt: best ? best.bestAt : null,
  };
}

/** Windows and details for the night of a local date. */
export function planNight(request: PlanRequest, nightOf: string): NightPlan {
  return new Planner(request).night(nightSpan(request.site, nightOf));
}

/** Windows and details for every night from `from` through `to` (local dates, inclusive). */
export function planNights(request: PlanRequest, from: string, to: string): NightPlan[] {
  const planner = new Planner(request);
  return nightsBetween(request.site, from, to).map((span) => planner.night(span));
}

/** The lean semester scan: per night, observable minutes and the best airmass. */
export function scanNights(request: PlanRequest, from: string, count: number): NightSummary[] {
  const planner = new Planner(request);
  return nightsFrom(request.site, from, count).map((span) => planner.summary(span));
}
