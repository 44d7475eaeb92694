/** The one plain line beside each suggestion. */
import { KIND_WORDS } from "./words";
import type { DisplacedPart, SlotSuggestion } from "./types";

const STRENGTH_TEXT: Record<SlotSuggestion["strengths"][number], string> = {
  earliest: "Earliest start",
  airmass: "Best airmass",
  displacement: "Least displacement",
};

export function formatLead(minutes: number): string {
  const m = Math.max(0, Math.round(minutes));
  if (m < 60) return `${m} min`;
  if (m < 48 * 60) {
    const h = Math.floor(m / 60);
    const rest = m % 60;
    return rest ? `${h} h ${rest} min` : `${h} h`;
  }
  const days = Math.round((m / 1440) * 10) / 10;
  return `${days} days`;
}

function part(d: DisplacedPart): string {
  const what = d.kind === "science" || d.kind === "payback" ? `${d.programCode} (rank ${d.rank}${d.kind === "payback" ? ", payback" : ""})` : `${d.programCode} (${KIND_WORDS[d.kind]})`;
  return `${Math.round(d.minutes)} min of ${what}`;
}

function displacementText(s: Pick<SlotSuggestion, "displaced" | "interrupts">): string {
  if (s.displaced.length === 0) return "displaces nothing (unscheduled time)";
  const parts = s.displaced.map(part);
  const list = parts.length > 1 ? `${parts.slice(0, -1).join(", ")} and ${parts[parts.length - 1]}` : parts[0];
  const breakIn = s.interrupts
    ? `breaks into ${s.interrupts.programCode}${s.interrupts.inProgress ? " while it is observing" : ""} (+${s.interrupts.setupMinutes} min setup), `
    : "";
  return `${breakIn}displaces ${list}`;
}

export function explain(s: Omit<SlotSuggestion, "explanation" | "score">, now: number): string {
  const lead = s.strengths.length ? `${s.strengths.map((x) => STRENGTH_TEXT[x]).join(", ")}: ` : "";
  const airmass = s.airmass === null ? "airmass unknown" : `mean airmass ${s.airmass.toFixed(2)}`;
  return `${lead}${s.telescopeCode} starting in ${formatLead((s.start - now) / 60_000)}; ${displacementText(s)}; ${airmass}.`;
}
