// computeVisibility: a parsed visibility request in, a JSON-ready answer out. Pure: no
// clock, no I/O. Instants go out as ISO 8601 UTC ("…Z") with a local-time twin for display.

import {
  type CurvePoint,
  Ephemeris,
  fadingClock,
  formatDec,
  formatLocalIso,
  formatUtcIso,
  type Instant,
  type NightEvents,
  type NightPlan,
  nightsBetween,
  nightSpan,
  Planner,
  type PlanRequest,
  type Site,
  type SunAvoidanceStatus,
  type Target,
  formatRa,
} from "../sky";
import type { VisibilityRequest } from "./schema";

export const PLANNING_DISCLAIMER =
  "Planning aid only: the decision to open, point or close a telescope rests with the night assistant and the observatory's own operating procedures and safety rules.";

export const round = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;
export const roundOrNull = (x: number | null, digits: number) => (x === null ? null : round(x, digits));

interface Moment {
  utc: string;
  local: string;
}

function moment(t: Instant | null, timeZone: string): Moment | null {
  return t === null ? null : { utc: formatUtcIso(t), local: formatLocalIso(t, timeZone) };
}

export interface VisibilityWindow {
  start: Moment;
  end: Moment;
  durationMinutes: number;
  bestAltitudeDeg: number;
  bestAirmass: number | null;
  bestAt: Moment;
}

export interface VisibilityNight {
  nightOf: string;
  start: Moment;
  end: Moment;
  twilight: {
    sunset: Moment | null;
    civilDusk: Moment | null;
    nauticalDusk: Moment | null;
    astronomicalDusk: Moment | null;
    astronomicalDawn: Moment | null;
    nauticalDawn: Moment | null;
    civilDawn: Moment | null;
    sunrise: Moment | null;
    solarMidnight: Moment;
    sunAltitudeAtMidnightDeg: number;
  };
  dark: { start: Moment; end: Moment }[];
  windows: VisibilityWindow[];
  observableMinutes: number;
  bestAirmass: number | null;
  bestAltitudeDeg: number | null;
  bestAt: Moment | null;
  moon: {
    illumination: number;
    altitudeAtMidnightDeg: number;
    closestSeparationDeg: number | null;
    rise: Moment | null;
    set: Moment | null;
  };
  sunAvoidance: { status: SunAvoidanceStatus; limitDeg: number; closestDeg: number | null; reason: string };
  notes: string[];
}

export interface VisibilityResult {
  site: { name: string | null; latitudeDeg: number; longitudeDeg: number; heightM: number; timeZone: string };
  target: {
    kind: "fixed" | "ephemeris";
    name: string | null;
    ra: string | null;
    dec: string | null;
    raDeg: number | null;
    decDeg: number | null;
  };
  limits: { minAltitudeDeg: number; maxAirmass: number | null; darkness: string; sunAvoidanceDeg: number };
  nights: VisibilityNight[];
  summary: {
    nights: number;
    nightsWithWindows: number;
    observableMinutes: number;
    bestAirmass: number | null;
    bestAt: Moment | null;
    bestNightOf: string | null;
  };
  sunAvoidance: { status: SunAvoidanceStatus; reason: string };
  /** Airmass chart data, single-night requests only. */
  curve: {
    stepMinutes: number;
    points: {
      time: string;
      altitudeDeg: number | null;
      azimuthDeg: number | null;
      airmass: number | null;
      sunAltitudeDeg: number;
      moonAltitudeDeg: number;
      moonSeparationDeg: number | null;
    }[];
  } | null;
  fading: {
    source: "H-G" | "ephemeris";
    limitingMagnitude: number;
    magnitudeAtStart: number | null;
    fainterThanLimitAt: Moment | null;
    alreadyFainter: boolean;
    coverageEnd: Moment;
    reason: string;
  } | null;
  conventions: Record<string, string>;
  disclaimer: string;
}

function toTarget(t: VisibilityRequest["target"]): { target: Target; ephemeris: Ephemeris | null } {
  if (t.kind === "fixed") {
    return {
      target: {
        kind: "fixed",
        raDeg: t.ra,
        decDeg: t.dec,
        pmRaMasPerYr: t.pmRaMasPerYr,
        pmDecMasPerYr: t.pmDecMasPerYr,
      },
      ephemeris: null,
    };
  }
  const ephemeris = new Ephemeris(
    t.rows.map((r) => ({
      time: Date.parse(r.time),
      raDeg: r.ra,
      decDeg: r.dec,
      rAu: r.rAu,
      deltaAu: r.deltaAu,
      magnitude: r.magnitude,
    })),
  );
  return { target: { kind: "ephemeris", ephemeris }, ephemeris };
}

/** A night's Sun events, each in UTC and the site's local time. */
export function twilightOut(e: NightEvents, tz: string): VisibilityNight["twilight"] {
  const m = (t: Instant | null) => moment(t, tz);
  return {
    sunset: m(e.sunset),
    civilDusk: m(e.civilDusk),
    nauticalDusk: m(e.nauticalDusk),
    astronomicalDusk: m(e.astronomicalDusk),
    astronomicalDawn: m(e.astronomicalDawn),
    nauticalDawn: m(e.nauticalDawn),
    civilDawn: m(e.civilDawn),
    sunrise: m(e.sunrise),
    solarMidnight: m(e.solarMidnight)!,
    sunAltitudeAtMidnightDeg: round(e.sunAltitudeAtMidnightDeg, 2),
  };
}

function nightOut(plan: NightPlan, tz: string): VisibilityNight {
  const m = (t: Instant | null) => moment(t, tz);
  return {
    nightOf: plan.nightOf,
    start: m(plan.start)!,
    end: m(plan.end)!,
    twilight: twilightOut(plan.events, tz),
    dark: plan.dark.map((d) => ({ start: m(d.start)!, end: m(d.end)! })),
    windows: plan.windows.map((w) => ({
      start: m(w.start)!,
      end: m(w.end)!,
      durationMinutes: round(w.durationMinutes, 1),
      bestAltitudeDeg: round(w.bestAltitudeDeg, 2),
      bestAirmass: roundOrNull(w.bestAirmass, 3),
      bestAt: m(w.bestAt)!,
    })),
    observableMinutes: round(plan.observableMinutes, 1),
    bestAirmass: roundOrNull(plan.bestAirmass, 3),
    bestAltitudeDeg: roundOrNull(plan.bestAltitudeDeg, 2),
    bestAt: m(plan.bestAt),
    moon: {
      illumination: round(plan.moon.illumination, 3),
      altitudeAtMidnightDeg: round(plan.moon.altitudeAtMidnightDeg, 2),
      closestSeparationDeg: roundOrNull(plan.moon.closestSeparationDeg, 2),
      rise: m(plan.moon.rise),
      set: m(plan.moon.set),
    },
    sunAvoidance: {
      ...plan.sunAvoidance,
      closestDeg: roundOrNull(plan.sunAvoidance.closestDeg, 2),
    },
    notes: plan.notes,
  };
}

function overallSunAvoidance(nights: NightPlan[]): { status: SunAvoidanceStatus; reason: string } {
  if (nights.length === 1) return { status: nights[0]!.sunAvoidance.status, reason: nights[0]!.sunAvoidance.reason };
  const refused = nights.filter((n) => n.sunAvoidance.status === "refused");
  const restricted = nights.filter((n) => n.sunAvoidance.status === "restricted");
  if (refused.length === nights.length) {
    return { status: "refused", reason: `Refused for sun avoidance on every night (${nights.length}).` };
  }
  if (refused.length + restricted.length > 0) {
    const names = [...refused, ...restricted].slice(0, 5).map((n) => n.nightOf);
    return {
      status: "restricted",
      reason: `Sun avoidance refuses ${refused.length} and shortens ${restricted.length} of ${nights.length} nights (first: ${names.join(", ")}).`,
    };
  }
  return { status: "clear", reason: "Clear of the Sun's avoidance zone on every night." };
}

/** The engine's answer before formatting: instants as epoch milliseconds. */
export interface VisibilityPlan {
  site: Site;
  /** The engine's effective limits (the stricter of telescope and request). */
  minAltitudeDeg: number;
  nights: NightPlan[];
  /** Airmass chart samples, single-night requests only. */
  curve: CurvePoint[] | null;
  ephemeris: Ephemeris | null;
}

/** computeVisibility without the formatting, for callers that want the numbers (the request feasibility check). */
export function planVisibility(input: VisibilityRequest): VisibilityPlan {
  const site: Site = {
    latitudeDeg: input.site.latitudeDeg,
    longitudeDeg: input.site.longitudeDeg,
    heightM: input.site.heightM,
    timeZone: input.site.timeZone,
  };
  const { target, ephemeris } = toTarget(input.target);
  const request: PlanRequest = {
    site,
    target,
    telescope: input.telescope,
    constraints: input.constraints,
    options: { refraction: input.options.refraction, stepMinutes: input.options.stepMinutes },
  };
  const planner = new Planner(request);
  const spans =
    input.when.night !== undefined
      ? [nightSpan(site, input.when.night)]
      : nightsBetween(site, input.when.from!, input.when.to!);
  const nights = spans.map((span) => planner.night(span));

  let curve: CurvePoint[] | null = null;
  if (spans.length === 1) {
    const span = spans[0]!;
    const e = nights[0]!.events;
    const step = input.options.curveStepMinutes;
    // Sunset to sunrise with an hour either side, or the whole night if the Sun stays up or down.
    const from = e.sunset !== null ? Math.max(span.start, e.sunset - 3_600_000) : span.start;
    const to = e.sunrise !== null ? Math.min(span.end, e.sunrise + 3_600_000) : span.end;
    const aligned = Math.ceil(from / (step * 60_000)) * step * 60_000;
    curve = planner.curve(span, step, aligned, to);
  }
  return { site, minAltitudeDeg: planner.limits.minAltitudeDeg, nights, curve, ephemeris };
}

export function computeVisibility(input: VisibilityRequest): VisibilityResult {
  const tz = input.site.timeZone;
  const { site, minAltitudeDeg, nights: plans, curve: samples, ephemeris } = planVisibility(input);
  const curve: VisibilityResult["curve"] =
    samples === null
      ? null
      : {
          stepMinutes: input.options.curveStepMinutes,
          points: samples.map((p) => ({
            time: formatUtcIso(p.time),
            altitudeDeg: roundOrNull(p.altitudeDeg, 3),
            azimuthDeg: roundOrNull(p.azimuthDeg, 3),
            airmass: roundOrNull(p.airmass, 4),
            sunAltitudeDeg: round(p.sunAltitudeDeg, 3),
            moonAltitudeDeg: round(p.moonAltitudeDeg, 3),
            moonSeparationDeg: roundOrNull(p.moonSeparationDeg, 3),
          })),
        };

  let fading: VisibilityResult["fading"] = null;
  const limitingMagnitude = input.instrument?.limitingMagnitude;
  if (ephemeris && limitingMagnitude !== undefined && input.target.kind === "ephemeris") {
    const H = input.target.absoluteMagnitude;
    const hasMagnitudes = ephemeris.rows.some((r) => r.magnitude !== undefined);
    if (H !== undefined || hasMagnitudes) {
      const clock = fadingClock({ ephemeris, H, G: input.target.slopeG, limitingMagnitude, from: plans[0]!.start });
      const when = clock.fainterThanLimitAt;
      const mag = (x: number) => x.toFixed(1);
      const reason = clock.alreadyFainter
        ? `Already fainter than the limiting magnitude ${mag(limitingMagnitude)} (V ≈ ${mag(clock.magnitudeAtStart!)}).`
        : when !== null
          ? `Fades past V = ${mag(limitingMagnitude)} at ${formatUtcIso(when)}.`
          : clock.magnitudeAtStart === null
            ? "No magnitude is known at the start of the request."
            : `Stays brighter than V = ${mag(limitingMagnitude)} until the end of the ephemeris (${formatUtcIso(clock.coverageEnd)}).`;
      fading = {
        source: clock.source,
        limitingMagnitude,
        magnitudeAtStart: roundOrNull(clock.magnitudeAtStart, 2),
        fainterThanLimitAt: moment(when, tz),
        alreadyFainter: clock.alreadyFainter,
        coverageEnd: moment(clock.coverageEnd, tz)!,
        reason,
      };
    }
  }

  const withWindows = plans.filter((p) => p.windows.length > 0);
  let best: NightPlan | null = null;
  for (const p of withWindows) if (!best || (p.bestAltitudeDeg ?? -90) > (best.bestAltitudeDeg ?? -90)) best = p;

  return {
    site: { name: input.site.name ?? null, ...site, timeZone: tz },
    target:
      input.target.kind === "fixed"
        ? {
            kind: "fixed",
            name: input.target.name ?? null,
            ra: formatRa(input.target.ra),
            dec: formatDec(input.target.dec),
            raDeg: input.target.ra,
            decDeg: input.target.dec,
          }
        : { kind: "ephemeris", name: input.target.name ?? null, ra: null, dec: null, raDeg: null, decDeg: null },
    limits: {
      minAltitudeDeg: round(minAltitudeDeg, 3),
      maxAirmass: input.constraints.maxAirmass ?? input.telescope.maxAirmass ?? null,
      darkness: input.constraints.darkness,
      sunAvoidanceDeg: input.telescope.sunAvoidanceDeg,
    },
    nights: plans.map((p) => nightOut(p, tz)),
    summary: {
      nights: plans.length,
      nightsWithWindows: withWindows.length,
      observableMinutes: round(
        plans.reduce((sum, p) => sum + p.observableMinutes, 0),
        1,
      ),
      bestAirmass: best ? roundOrNull(best.bestAirmass, 3) : null,
      bestAt: best ? moment(best.bestAt, tz) : null,
      bestNightOf: best ? best.nightOf : null,
    },
    sunAvoidance: overallSunAvoidance(plans),
    curve,
    fading,
    conventions: {
      times: "UTC, ISO 8601; each instant also given in the site's local time",
      altitude: input.options.refraction
        ? "degrees, refracted limits converted to geometric altitude"
        : "degrees, geometric (no refraction)",
      azimuth: "degrees from north through east",
      airmass: "Kasten & Young (1989); null below the horizon",
      coordinates: "ICRS/J2000 in; apparent places of date internally",
      night: "local mean noon to local mean noon, named by the local date it begins",
    },
    disclaimer: PLANNING_DISCLAIMER,
  };
}
