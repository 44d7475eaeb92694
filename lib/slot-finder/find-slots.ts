/**
 * The slot finder: feasible slots of the requested length on the acceptable telescopes,
 * inside observable windows and the request's usable time, ranked by one score that
 * weighs urgency (how soon), observing quality (airmass) and displacement cost (see
 * weights.ts). Pure: the schedule, the windows and `now` are all inputs.
 *
 * No slot starts before now plus the telescope's setup time; with urgency `now` the
 * earliest slot therefore breaks into the block in progress at exactly that moment. No
 * slot ends after the target fades past the instrument's limit (the fading clock, as in
 * the feasibility check): an override then would displace science for nothing.
 * Suggestions on one telescope that overlap a better one by more than half are dropped,
 * so the list offers real alternatives rather than the same slot shifted by a minute.
 */
import { alreadyFainterText, fadeText } from "@/lib/requests/feasibility/fading";
import { formatUt } from "@/lib/time/format";
import { candidateSlots, MINUTE, setupMinutesFor } from "./candidates";
import { weigh } from "./evaluate";
import { explain } from "./explain";
import type { SlotFinderInput, SlotFinderResult, SlotSuggestion } from "./types";
import { airmassPoints, delayPoints } from "./weights";

const DEFAULT_LIMIT = 8;

type Scored = Omit<SlotSuggestion, "explanation" | "strengths">;

function tooSimilar(a: Scored, b: Scored, durationMs: number): boolean {
  if (a.telescopeId !== b.telescopeId) return false;
  const overlap = Math.min(a.end, b.end) - Math.max(a.start, b.start);
  return overlap > durationMs / 2;
}

function compare(a: Scored, b: Scored): number {
  return a.score - b.score || a.start - b.start || a.telescopeCode.localeCompare(b.telescopeCode);
}

export function findSlots(input: SlotFinderInput): SlotFinderResult {
  const durationMs = input.durationMinutes * MINUTE;
  // A fade after the usable time ends changes nothing.
  const fade = input.fade && input.fade.at < input.horizon.end ? input.fade : null;
  const end = fade ? fade.at : input.horizon.end;
  const scored: Scored[] = [];
  let considered = 0;
  let windowsLongEnough = 0;
  for (const telescope of input.telescopes) {
    const setup = setupMinutesFor(telescope, input.interruptSetupMinutes);
    const usable = { start: Math.max(input.horizon.start, input.now + setup * MINUTE), end };
    const candidates = candidateSlots(telescope, usable, input.durationMinutes);
    if (candidates.length > 0) windowsLongEnough++;
    for (const c of candidates) {
      considered++;
      const w = weigh(c, telescope.blocks, telescope.airmass, setup, input.now);
      if (!w) continue;
      const score = delayPoints(input.urgency, c.start, input.now) + airmassPoints(w.airmass) + w.displacementCost;
      scored.push({ telescopeId: telescope.telescopeId, telescopeCode: telescope.code, start: c.start, end: c.end, ...w, score });
    }
  }

  const kept: Scored[] = [];
  for (const s of scored.sort(compare)) {
    if (kept.length >= (input.limit ?? DEFAULT_LIMIT)) break;
    if (!kept.some((k) => tooSimilar(k, s, durationMs))) kept.push(s);
  }

  // A strength is named only where the list differs on it: "best airmass" among equals says nothing.
  const best = (value: (k: Scored) => number) => {
    const values = kept.map(value);
    const min = Math.min(...values);
    return values.some((v) => v !== min) ? min : null;
  };
  const earliest = best((k) => k.start);
  const bestAirmass = best((k) => k.airmass ?? Infinity);
  const leastCost = best((k) => k.displacementCost);
  const suggestions = kept.map((k): SlotSuggestion => {
    const strengths: SlotSuggestion["strengths"] = [];
    if (k.start === earliest) strengths.push("earliest");
    if (k.airmass !== null && k.airmass === bestAirmass) strengths.push("airmass");
    if (k.displacementCost === leastCost) strengths.push("displacement");
    const withStrengths = { ...k, strengths };
    return { ...withStrengths, explanation: explain(withStrengths, input.now) };
  });

  let reason: string | null = null;
  if (suggestions.length === 0) {
    if (fade?.alreadyFainter) reason = `${alreadyFainterText(fade)}: no slot can reach it, so none is offered.`;
    else if (windowsLongEnough > 0) reason = "Every observable window long enough overlaps another override: no slot can be offered.";
    else if (fade) reason = `No observable window of ${input.durationMinutes} min is left on any acceptable telescope before ${fadeText(fade)}; later slots cannot reach it.`;
    else reason = `No observable window of ${input.durationMinutes} min is left on any acceptable telescope before the deadline.`;
  }
  const note = fade && !fade.alreadyFainter ? `No slot is offered after ${formatUt(new Date(fade.at))} UT, when the target fades past ${fade.limit}: later slots cannot reach it.` : null;
  return { suggestions, considered, reason, note };
}
