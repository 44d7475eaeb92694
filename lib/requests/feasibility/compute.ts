/**
 * Feasibility of a ToO request on its acceptable telescopes. Pure (no database, no clock:
 * `now` is passed in), so the form's live preview, the submit check and the tests all run
 * the same code.
 *
 * The horizon in which windows count runs from max(earliest start, now) to the earliest of
 * the latest end, the deadline and the instant the target fades past the instrument's
 * limit (the fading clock): a window after the fade cannot reach the target, so it neither
 * makes the request feasible nor appears in the report.
 *
 * Work plan, per telescope: the first CHART_NIGHTS nights one by one (each brings the
 * airmass curve for the chart), the rest in one range call. Telescopes sharing a site see
 * the same sky, so only the first telescope of a site pays for the curves.
 */
import { airmassKastenYoung, type NightPlan, nightOfInstant, nightsBetween, type Site } from "@/lib/sky";
import { PLANNING_DISCLAIMER, planVisibility, round, roundOrNull, twilightOut, type VisibilityPlan, type VisibilityRequest } from "@/lib/visibility";
import type { FeasibilityInput } from "../schemas";
import { fadingOf } from "./fading";
import { visibilityRequest, visibilityTarget } from "./inputs";
import type { FeasibilityReport, InstrumentRef, SiteSky, SkyNight, TelescopeFeasibility, TelescopeSky } from "./types";
import { feasibilityNight, refusalReasons, telescopeVerdict, toSecond } from "./verdict";

/** A three-day window touches four nights (the one in progress and three more): chart them all. */
export const CHART_NIGHTS = 4;
/** The request schema keeps windows within 31 days; one spare night for time zones. */
const MAX_NIGHTS = 33;

export const SUN_SAFETY_NOTE =
  "A request that breaks a telescope's sun avoidance limit is refused, never scheduled: pointing near the Sun can destroy instruments and blind people.";

function isOver(plan: VisibilityPlan, horizonStart: number): boolean {
  const dark = plan.nights[0]?.dark ?? [];
  return dark.length > 0 && dark.every((d) => toSecond(d.end) <= horizonStart);
}

function skyNight(plan: VisibilityPlan, timeZone: string): SkyNight | null {
  const night = plan.nights[0];
  if (!night || !plan.curve) return null;
  return {
    nightOf: night.nightOf,
    twilight: twilightOut(night.events, timeZone),
    moonIllumination: round(night.moon.illumination, 3),
    // Parallel arrays: a third of the bytes of one object per sample, for the same numbers.
    samples: {
      t: plan.curve.map((p) => toSecond(p.time)),
      airmass: plan.curve.map((p) => roundOrNull(p.airmass, 4)),
      altitudeDeg: plan.curve.map((p) => roundOrNull(p.altitudeDeg, 3)),
      moonAltitudeDeg: plan.curve.map((p) => round(p.moonAltitudeDeg, 3)),
      sunAltitudeDeg: plan.curve.map((p) => round(p.sunAltitudeDeg, 3)),
    },
  };
}

export interface ComputeOptions {
  /** The sky engine's entry point; the preview passes a cached one (lib/requests/feasibility/cache.ts). */
  visibility?: (request: VisibilityRequest) => VisibilityPlan;
}

export function computeFeasibility(
  input: FeasibilityInput,
  telescopes: TelescopeSky[],
  instrument: InstrumentRef | null,
  now: Date,
  { visibility = planVisibility }: ComputeOptions = {},
): FeasibilityReport {
  const horizonStart = Math.max(input.earliestStart.getTime(), now.getTime());
  const requestEnd = Math.min(input.latestEnd.getTime(), input.deadline.getTime());
  const { fading, cut: fade } = fadingOf(input.target, instrument, horizonStart, requestEnd);
  const horizonEnd = fade ? fade.at : requestEnd;
  const target = visibilityTarget(input.target);
  const skies = new Map<string, SiteSky>();
  const notes = new Set<string>();

  const results: TelescopeFeasibility[] = telescopes.map((telescope) => {
    const site: Site = { latitudeDeg: telescope.site.latitudeDeg, longitudeDeg: telescope.site.longitudeDeg, heightM: telescope.site.heightM, timeZone: telescope.site.timeZone };
    const nights: NightPlan[] = [];
    let engineMinAltitudeDeg: number | null = null;
    if (horizonEnd > horizonStart) {
      const first = nightOfInstant(site, horizonStart).nightOf;
      const last = nightOfInstant(site, horizonEnd - 1).nightOf;
      const spans = nightsBetween(site, first, last).slice(0, MAX_NIGHTS);
      let rest = spans;
      if (!skies.has(telescope.site.id)) {
        const sky: SiteSky = { siteId: telescope.site.id, siteName: telescope.site.name, timeZone: telescope.site.timeZone, nights: [] };
        let next = 0;
        while (next < spans.length && sky.nights.length < CHART_NIGHTS) {
          const result = visibility(visibilityRequest(input, telescope, target, { night: spans[next]!.nightOf }));
          next += 1;
          engineMinAltitudeDeg = result.minAltitudeDeg;
          nights.push(...result.nights);
          // A night whose darkness ended before the horizon opens is not worth a chart.
          const chart = isOver(result, horizonStart) ? null : skyNight(result, telescope.site.timeZone);
          if (chart) sky.nights.push(chart);
        }
        skies.set(telescope.site.id, sky);
        rest = spans.slice(next);
      }
      if (rest.length > 0) {
        const result = visibility(visibilityRequest(input, telescope, target, { from: rest[0]!.nightOf, to: rest[rest.length - 1]!.nightOf }));
        engineMinAltitudeDeg = result.minAltitudeDeg;
        nights.push(...result.nights);
      }
    }
    const minAltitudeDeg = engineMinAltitudeDeg === null ? telescope.minAltitudeDeg : round(engineMinAltitudeDeg, 3);
    const perNight = nights.map((n) => feasibilityNight(n, horizonStart, horizonEnd));
    for (const n of perNight) for (const text of n.notes) notes.add(text);
    return telescopeVerdict({
      telescope: {
        telescopeId: telescope.id,
        code: telescope.code,
        name: telescope.name,
        siteId: telescope.site.id,
        siteName: telescope.site.name,
        timeZone: telescope.site.timeZone,
        // The same airmass formula as the engine, so the chart's limit line meets its windows.
        airmassLimit: Math.round((airmassKastenYoung(minAltitudeDeg) ?? 40) * 1000) / 1000,
        minAltitudeDeg: Math.round(minAltitudeDeg * 100) / 100,
        sunAvoidanceDeg: telescope.sunAvoidanceDeg,
      },
      nights: perNight,
      durationMinutes: input.durationMinutes,
      horizonStart,
      horizonEnd,
      fade,
    });
  });

  if (fading?.fainterThanLimitAt && Date.parse(fading.fainterThanLimitAt) < requestEnd) {
    notes.add(`The target is predicted to fade past the instrument's limit at ${fading.fainterThanLimitAt.slice(0, 16).replace("T", " ")} UT: windows after that will not reach it.`);
  }
  const reasons = refusalReasons(results, input.durationMinutes, fade);
  return {
    computedAt: now.toISOString(),
    horizon: { start: new Date(horizonStart).toISOString(), end: new Date(Math.max(horizonEnd, horizonStart)).toISOString() },
    durationMinutes: input.durationMinutes,
    verdict: reasons.length === 0 ? "feasible" : "refused",
    reasons,
    telescopes: results,
    skies: [...skies.values()],
    fading,
    notes: [...notes],
    disclaimer: `${PLANNING_DISCLAIMER} ${SUN_SAFETY_NOTE}`,
  };
}
