/**
 * From the sky engine's nights to a request's verdict. Windows are clipped to the
 * request's horizon; a telescope is feasible when one clipped window is at least as long
 * as the time needed. Sun avoidance is a refusal, never a warning: a telescope on which
 * the target is inside the Sun's avoidance zone on every night is refused outright, and a
 * request that lists such a telescope cannot be filed. When the fading clock ends the
 * horizon early, the reasons name the fade rather than the deadline.
 */
import type { NightPlan, SunAvoidanceStatus } from "@/lib/sky";
import { formatUt } from "@/lib/time/format";
import { round, roundOrNull } from "@/lib/visibility";
import { alreadyFainterText, type FadeCut, fadeText } from "./fading";
import type { FeasibilityNight, FeasibilityWindow, TelescopeFeasibility, TelescopeVerdict } from "./types";

const round1 = (x: number) => Math.round(x * 10) / 10;

/** Instants leave the report to the whole second, as the engine's formatted answers do. */
export const toSecond = (t: number) => Math.round(t / 1000) * 1000;

function clip(night: NightPlan, start: number, end: number): FeasibilityWindow[] {
  const out: FeasibilityWindow[] = [];
  for (const w of night.windows) {
    const s = Math.max(toSecond(w.start), start);
    const e = Math.min(toSecond(w.end), end);
    if (e - s >= 1000) {
      out.push({ start: new Date(s).toISOString(), end: new Date(e).toISOString(), durationMinutes: round1((e - s) / 60_000), bestAirmass: roundOrNull(w.bestAirmass, 3) });
    }
  }
  return out;
}

export function feasibilityNight(night: NightPlan, horizonStart: number, horizonEnd: number): FeasibilityNight {
  const windows = clip(night, horizonStart, horizonEnd);
  const airmasses = windows.map((w) => w.bestAirmass).filter((a): a is number => a !== null);
  return {
    nightOf: night.nightOf,
    windows,
    observableMinutes: round1(windows.reduce((sum, w) => sum + w.durationMinutes, 0)),
    bestAirmass: airmasses.length > 0 ? Math.min(...airmasses) : null,
    moonIllumination: round(night.moon.illumination, 3),
    moonClosestDeg: roundOrNull(night.moon.closestSeparationDeg, 2),
    sunAvoidance: night.sunAvoidance.status,
    sunAvoidanceReason: night.sunAvoidance.reason,
    notes: night.notes,
  };
}

function sunSummary(nights: FeasibilityNight[]): { status: SunAvoidanceStatus; reason: string } {
  if (nights.length === 0) return { status: "clear", reason: "No night of the window is left to check." };
  const refused = nights.filter((n) => n.sunAvoidance === "refused");
  const restricted = nights.filter((n) => n.sunAvoidance === "restricted");
  if (refused.length === nights.length) return { status: "refused", reason: refused[0]!.sunAvoidanceReason };
  if (refused.length + restricted.length > 0) {
    return {
      status: "restricted",
      reason: `Sun avoidance rules out ${refused.length} and shortens ${restricted.length} of ${nights.length} nights; the windows shown respect it.`,
    };
  }
  return { status: "clear", reason: "Clear of the Sun's avoidance zone on every night." };
}

const slotText = (w: FeasibilityWindow) => `${formatUt(new Date(w.start))}–${formatUt(new Date(w.end)).slice(11)} UT`;

export interface VerdictInput {
  telescope: Omit<TelescopeFeasibility, "verdict" | "reason" | "sunAvoidance" | "longestWindowMinutes" | "firstSlot" | "nights">;
  nights: FeasibilityNight[];
  durationMinutes: number;
  horizonStart: number;
  /** Already cut by the fade, when there is one. */
  horizonEnd: number;
  /** Where the fading clock ended the horizon before the latest end and the deadline. */
  fade?: FadeCut | null;
}

export function telescopeVerdict({ telescope, nights, durationMinutes, horizonStart, horizonEnd, fade = null }: VerdictInput): TelescopeFeasibility {
  const sunAvoidance = sunSummary(nights);
  const windows = nights.flatMap((n) => n.windows);
  const longest = windows.reduce((m, w) => Math.max(m, w.durationMinutes), 0);
  const firstSlot = windows.find((w) => w.durationMinutes >= durationMinutes - 1e-6) ?? null;
  let verdict: TelescopeVerdict;
  let reason: string;
  if (sunAvoidance.status === "refused") {
    verdict = "sun_refused";
    reason = `Refused for sun avoidance on ${telescope.code}: ${sunAvoidance.reason.replace(/^Refused for sun avoidance: /, "")}`;
  } else if (fade?.alreadyFainter) {
    verdict = "no_window";
    reason = `${alreadyFainterText(fade)}: no window on ${telescope.code} can reach it.`;
  } else if (horizonEnd - horizonStart < durationMinutes * 60_000) {
    verdict = "no_window";
    const left = Math.max(0, Math.round((horizonEnd - horizonStart) / 60_000));
    reason = fade
      ? `Only ${left} min remain before ${fadeText(fade)}; the request needs ${durationMinutes} min.`
      : horizonEnd <= horizonStart
        ? `The deadline (${formatUt(new Date(horizonEnd))} UT) has passed: there is no time left to observe.`
        : `Only ${left} min remain before the deadline; the request needs ${durationMinutes} min.`;
  } else if (firstSlot === null) {
    verdict = "no_window";
    const from = formatUt(new Date(horizonStart));
    if (windows.length > 0) {
      reason = `The longest observable window on ${telescope.code} before ${fade ? fadeText(fade) : "the deadline"} is ${Math.floor(longest)} min; the request needs ${durationMinutes} min.`;
    } else if (fade) {
      reason = `No observable window on ${telescope.code} between ${from} UT and ${formatUt(new Date(fade.at))} UT, when the target fades past ${fade.limit}.`;
    } else {
      reason = `No observable window on ${telescope.code} between ${from} UT and the deadline ${formatUt(new Date(horizonEnd))} UT.`;
    }
  } else {
    verdict = "feasible";
    const airmass = firstSlot.bestAirmass === null ? "" : `, best airmass ${firstSlot.bestAirmass.toFixed(2)}`;
    reason = `First window long enough on ${telescope.code}: ${slotText(firstSlot)} (${Math.floor(firstSlot.durationMinutes)} min${airmass}).`;
  }
  return { ...telescope, verdict, reason, sunAvoidance, longestWindowMinutes: round1(longest), firstSlot, nights };
}

/** The request's reasons for refusal, or none when it may be filed. */
export function refusalReasons(telescopes: TelescopeFeasibility[], durationMinutes: number, fade: FadeCut | null = null): string[] {
  if (telescopes.length === 0) return ["Choose at least one acceptable telescope."];
  const reasons = telescopes.filter((t) => t.verdict === "sun_refused").map((t) => `${t.reason} Remove ${t.code} from the acceptable telescopes or change the window.`);
  const withoutWindow = telescopes.filter((t) => t.verdict === "no_window").map((t) => t.reason);
  if (!telescopes.some((t) => t.verdict === "feasible") && withoutWindow.length > 0) {
    const headline = fade?.alreadyFainter
      ? `${alreadyFainterText(fade)}: no window on any acceptable telescope can reach it.`
      : `No observable window of ${durationMinutes} min before ${fade ? fadeText(fade) : "the deadline"} on any acceptable telescope.`;
    reasons.push(headline, ...withoutWindow);
  }
  return reasons;
}
