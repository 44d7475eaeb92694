/**
 * The fading clock for a moving target: predicted magnitude along the ephemeris (IAU H–G
 * when H is given, else the table's own magnitudes) against the chosen instrument's
 * limiting magnitude, from the start of the request's horizon.
 */
import { Ephemeris, fadingClock } from "@/lib/sky";
import { formatUt } from "@/lib/time/format";
import type { FeasibilityInput } from "../schemas";
import type { FadingSummary, InstrumentRef } from "./types";

const MAX_POINTS = 240;

function thin<T>(points: T[]): T[] {
  if (points.length <= MAX_POINTS) return points;
  const step = (points.length - 1) / (MAX_POINTS - 1);
  return Array.from({ length: MAX_POINTS }, (_, i) => points[Math.round(i * step)]!);
}

export function fadingSummary(target: FeasibilityInput["target"], instrument: InstrumentRef | null, from: number): FadingSummary | null {
  if (target.kind !== "ephemeris" || !instrument) return null;
  const rows = target.ephemeris ?? [];
  const hasMagnitudes = rows.some((r) => r.magnitude !== undefined);
  if (rows.length < 2 || (target.hMag === undefined && !hasMagnitudes)) return null;
  const ephemeris = new Ephemeris(
    rows.map((r) => ({ time: Date.parse(r.time), raDeg: r.ra, decDeg: r.dec, rAu: r.rAu, deltaAu: r.deltaAu, magnitude: r.magnitude })),
  );
  const limit = instrument.limitingMagnitude;
  const clock = fadingClock({ ephemeris, H: target.hMag, G: target.gSlope, limitingMagnitude: limit, from });
  const mag = (x: number) => x.toFixed(1);
  const when = clock.fainterThanLimitAt;
  const reason = clock.alreadyFainter
    ? `Already fainter than ${instrument.code}'s limit V = ${mag(limit)} (predicted V ≈ ${mag(clock.magnitudeAtStart ?? limit)}).`
    : when !== null
      ? `Fades past ${instrument.code}'s limit V = ${mag(limit)} at ${formatUt(new Date(when))} UT.`
      : clock.magnitudeAtStart === null
        ? "No magnitude can be predicted at the start of the window (the ephemeris does not cover it)."
        : `Stays brighter than ${instrument.code}'s limit V = ${mag(limit)} to the end of the ephemeris (${formatUt(new Date(clock.coverageEnd))} UT).`;
  return {
    source: clock.source,
    instrument: `${instrument.code} — ${instrument.name}`,
    limitingMagnitude: limit,
    magnitudeAtStart: clock.magnitudeAtStart === null ? null : Math.round(clock.magnitudeAtStart * 100) / 100,
    fainterThanLimitAt: when === null ? null : new Date(when).toISOString(),
    alreadyFainter: clock.alreadyFainter,
    coverageEnd: new Date(clock.coverageEnd).toISOString(),
    reason,
    curve: thin(clock.curve.map((p) => ({ t: p.time, magnitude: Math.round(p.magnitude * 100) / 100 }))),
  };
}
