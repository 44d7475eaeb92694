import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { planSplice } from "@/lib/splice/plan";
import { findSlots } from "@/lib/slot-finder/find-slots";
import type { FinderBlock, FinderTelescope } from "@/lib/slot-finder/types";

const MIN = 60_000;
const T0 = Date.parse("2027-03-01T00:00:00Z");
const KINDS = ["science", "engineering", "discretionary", "too", "payback"] as const;

// A night of contiguous or gapped blocks, built from random lengths (in 15-min steps).
const schedule = fc.array(fc.record({ gap: fc.integer({ min: 0, max: 8 }), length: fc.integer({ min: 1, max: 16 }), kind: fc.constantFrom(...KINDS), rank: fc.integer({ min: 1, max: 5 }) }), { maxLength: 8 }).map((parts) => {
  let at = T0;
  return parts.map((p, i): FinderBlock => {
    const start = at + p.gap * 15 * MIN;
    at = start + p.length * 15 * MIN;
    return { id: `b${i}`, start, end: at, kind: p.kind, programId: `p${i}`, programCode: `P${i}`, rank: p.rank };
  });
});

const windows = fc.array(fc.record({ from: fc.integer({ min: 0, max: 40 }), length: fc.integer({ min: 1, max: 40 }) }), { minLength: 1, maxLength: 3 }).map((ws) =>
  ws.map((w) => {
    const start = T0 + w.from * 15 * MIN;
    const end = start + w.length * 15 * MIN;
    return { start, end, bestAt: (start + end) / 2, bestAirmass: 1.3 };
  }),
);

describe("slot finder invariants on random schedules", () => {
  it("every suggestion lies in a window and the usable time, starts after setup, never touches an override, and displaces what the splice would", () => {
    fc.assert(
      fc.property(schedule, windows, fc.integer({ min: 15, max: 180 }), fc.integer({ min: -60, max: 600 }), fc.constantFrom("now", "tonight", "within_days" as const), (blocks, ws, duration, nowOffset, urgency) => {
        const now = T0 + nowOffset * MIN;
        const telescope: FinderTelescope = { telescopeId: "t", code: "T", setupMinutes: 12, windows: ws, blocks };
        const horizon = { start: T0 - 60 * MIN, end: T0 + 20 * 3_600_000 };
        const { suggestions } = findSlots({ now, durationMinutes: duration, urgency, horizon, telescopes: [telescope], interruptSetupMinutes: 10 });
        for (const s of suggestions) {
          expect(s.end - s.start).toBe(duration * MIN);
          expect(s.start % MIN).toBe(0);
          expect(ws.some((w) => s.start >= w.start && s.end <= w.end)).toBe(true);
          expect(s.start).toBeGreaterThanOrEqual(now + 12 * MIN);
          expect(s.end).toBeLessThanOrEqual(horizon.end);
          expect(blocks.some((b) => b.kind === "too" && b.start < s.end && b.end > s.start)).toBe(false);
          const plan = planSplice(s, blocks.map((b) => ({ id: b.id, start: b.start, end: b.end, programId: b.programId, observerUserId: null })));
          expect(s.displacedMinutes).toBeCloseTo(plan.displacedMinutes, 9);
        }
        // Ranked: scores never decrease down the list.
        for (let i = 1; i < suggestions.length; i++) expect(suggestions[i]!.score).toBeGreaterThanOrEqual(suggestions[i - 1]!.score);
      }),
      { numRuns: 300 },
    );
  });
});
