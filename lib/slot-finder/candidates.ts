/**
 * Candidate slots on one telescope: in each observable window (clipped to what is still
 * usable), slots starting at the window's start, ending at its end, centred on the best
 * airmass, and starting or ending at every block boundary inside it — the places where a
 * slot displaces least or observes best. Starts fall on whole minutes, as approvals do.
 */
import type { FinderTelescope, FinderWindow } from "./types";

export const MINUTE = 60_000;
const ceilMinute = (t: number) => Math.ceil(t / MINUTE) * MINUTE;
const floorMinute = (t: number) => Math.floor(t / MINUTE) * MINUTE;

export interface Candidate {
  start: number;
  end: number;
  window: FinderWindow;
}

/** The setup time that applies on this telescope: its own, or the consortium's minimum when longer. */
export function setupMinutesFor(telescope: FinderTelescope, interruptSetupMinutes: number): number {
  return Math.max(telescope.setupMinutes, interruptSetupMinutes);
}

export function candidateSlots(
  telescope: FinderTelescope,
  usable: { start: number; end: number },
  durationMinutes: number,
): Candidate[] {
  const length = durationMinutes * MINUTE;
  const seen = new Set<number>();
  const out: Candidate[] = [];
  for (const window of telescope.windows) {
    const lo = ceilMinute(Math.max(window.start, usable.start));
    const hi = floorMinute(Math.min(window.end, usable.end) - length);
    if (hi < lo) continue;
    const wanted = [lo, hi, window.bestAt - length / 2];
    for (const b of telescope.blocks) {
      for (const edge of [b.start, b.end]) if (edge >= lo && edge <= hi + length) wanted.push(edge, edge - length);
    }
    for (const raw of wanted) {
      if (!Number.isFinite(raw)) continue;
      const start = Math.min(hi, Math.max(lo, Math.round(raw / MINUTE) * MINUTE));
      if (seen.has(start)) continue;
      seen.add(start);
      out.push({ start, end: start + length, window });
    }
  }
  return out.sort((a, b) => a.start - b.start);
}
