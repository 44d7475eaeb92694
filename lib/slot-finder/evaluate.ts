/** One candidate slot weighed: what it displaces, whether it breaks into a block, its airmass. */
import type { Candidate } from "./candidates";
import type { AirmassSample, DisplacedPart, FinderBlock } from "./types";
import { blockWeight } from "./weights";

const MINUTE = 60_000;

export interface Weighed {
  displaced: DisplacedPart[];
  displacedMinutes: number;
  interrupts: { programCode: string; setupMinutes: number; inProgress: boolean } | null;
  displacementCost: number;
  airmass: number | null;
}

/** Mean airmass of the samples inside [start, end]; the nearest sample when none falls inside. */
export function meanAirmass(samples: readonly AirmassSample[] | undefined, start: number, end: number): number | null {
  if (!samples || samples.length === 0) return null;
  let sum = 0;
  let n = 0;
  let nearest: AirmassSample | null = null;
  for (const s of samples) {
    if (s.t >= start && s.t <= end) {
      if (s.airmass !== null) {
        sum += s.airmass;
        n++;
      }
    } else if (s.airmass !== null) {
      const mid = (start + end) / 2;
      if (!nearest || Math.abs(s.t - mid) < Math.abs(nearest.t - mid)) nearest = s;
    }
  }
  return n > 0 ? sum / n : (nearest?.airmass ?? null);
}

/** Null when the slot would cut into another override (never allowed). */
export function weigh(candidate: Candidate, blocks: readonly FinderBlock[], samples: readonly AirmassSample[] | undefined, setupMinutes: number, now: number): Weighed | null {
  const displaced: DisplacedPart[] = [];
  let cost = 0;
  let interrupts: Weighed["interrupts"] = null;
  for (const b of blocks) {
    const lost = Math.min(b.end, candidate.end) - Math.max(b.start, candidate.start);
    if (lost <= 0) continue;
    if (b.kind === "too") return null;
    const minutes = lost / MINUTE;
    const weight = blockWeight(b.kind, b.rank);
    displaced.push({ blockId: b.id, programCode: b.programCode, kind: b.kind, rank: b.rank, minutes });
    cost += minutes * weight;
    if (b.start < candidate.start) {
      // Breaking into a block mid-way costs the setup time at that block's weight.
      interrupts = { programCode: b.programCode, setupMinutes, inProgress: b.start <= now && now < b.end };
      cost += setupMinutes * weight;
    }
  }
  const airmass = meanAirmass(samples, candidate.start, candidate.end) ?? candidate.window.bestAirmass;
  return { displaced, displacedMinutes: displaced.reduce((s, d) => s + d.minutes, 0), interrupts, displacementCost: cost, airmass };
}
