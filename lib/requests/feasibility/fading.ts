/**
 * The fading clock for a moving target: predicted magnitude along the ephemeris (IAU H–G
 * when H is given, else the table's own magnitudes) against the chosen instrument's
 * limiting magnitude, from the start of the request's horizon.
 *
 * The clock is part of the verdict, not only a note: no window counts once the target has
 * faded past the limit, so the feasibility check and the slot finder both end the request's
 * horizon at the fade (`fadeCut`).
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

/** Where the fading clock ends a request's horizon early. */
export interface FadeCut {
  /** Epoch ms (UTC) after which no window counts: the horizon's start when already fainter. */
  at: number;
  alreadyFainter: boolean;
  /** "CAM's limit V 21.0" */
  limit: string;
  /** Predicted V at the horizon's start, when known. */
  magnitudeAtStart: number | null;
}

/**
 * The cut the fading clock makes in the horizon [start, end), or null when the target stays
 * bright enough until `end` (or no magnitude can be predicted). The fade instant is taken
 * down to the whole second, as the report's windows are.
 */
export function fadeCut(fading: FadingSummary | null, instrumentCode: string, start: number, end: number): FadeCut | null {
  if (!fading || fading.fainterThanLimitAt === null || end <= start) return null;
  const at = fading.alreadyFainter ? start : Math.max(start, Math.floor(Date.parse(fading.fainterThanLimitAt) / 1000) * 1000);
  if (at >= end) return null;
  return {
    at,
    alreadyFainter: fading.alreadyFainter,
    limit: `${instrumentCode}'s limit V ${fading.limitingMagnitude.toFixed(1)}`,
    magnitudeAtStart: fading.magnitudeAtStart,
  };
}

/** The fade in words, to end a sentence: "the target fades past CAM's limit V 21.0 at 2027-03-11 02:00 UT". */
export function fadeText(cut: FadeCut): string {
  return `the target fades past ${cut.limit} at ${formatUt(new Date(cut.at))} UT`;
}

/** To begin a sentence: "The target is already fainter than CAM's limit V 21.0 (predicted V 22.3)". */
export function alreadyFainterText(cut: FadeCut): string {
  const predicted = cut.magnitudeAtStart === null ? "" : ` (predicted V ${cut.magnitudeAtStart.toFixed(1)})`;
  return `The target is already fainter than ${cut.limit}${predicted}`;
}

/** The fading clock for a request: its summary and the cut it makes in the horizon [start, end). */
export function fadingOf(
  target: FeasibilityInput["target"],
  instrument: InstrumentRef | null,
  start: number,
  end: number,
): { fading: FadingSummary | null; cut: FadeCut | null } {
  const fading = fadingSummary(target, instrument, start);
  return { fading, cut: instrument ? fadeCut(fading, instrument.code, start, end) : null };
}
