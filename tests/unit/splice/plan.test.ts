import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { applyPlan, InvalidSlotError, planSplice, type SpliceBlock } from "@/lib/splice/plan";

const t = (iso: string) => Date.parse(iso);
const block = (id: string, start: string, end: string, programId = `P-${id}`): SpliceBlock => ({ id, start: t(start), end: t(end), programId, observerUserId: `O-${id}` });

describe("planning a splice on constructed schedules", () => {
  it("splits a block when the slot lies inside it", () => {
    const plan = planSplice({ start: t("2027-01-10T02:00Z"), end: t("2027-01-10T03:00Z") }, [block("a", "2027-01-10T01:00Z", "2027-01-10T05:00Z")]);
    expect(plan.changes).toEqual([expect.objectContaining({ type: "split", firstEnd: t("2027-01-10T02:00Z"), secondStart: t("2027-01-10T03:00Z") })]);
    expect(plan.displacedMinutes).toBe(60);
  });

  it("trims the end of one block and the start of the next when the slot spans the boundary", () => {
    const plan = planSplice({ start: t("2027-01-10T03:30Z"), end: t("2027-01-10T04:45Z") }, [
      block("b", "2027-01-10T04:00Z", "2027-01-10T07:00Z"),
      block("a", "2027-01-10T01:00Z", "2027-01-10T04:00Z"),
    ]);
    expect(plan.changes.map((c) => c.type)).toEqual(["trim-end", "trim-start"]);
    expect(plan.displacements.map((d) => [d.blockId, d.minutes])).toEqual([["a", 30], ["b", 45]]);
  });

  it("removes a block the slot covers entirely", () => {
    const plan = planSplice({ start: t("2027-01-10T00:00Z"), end: t("2027-01-10T06:00Z") }, [block("a", "2027-01-10T01:00Z", "2027-01-10T04:00Z")]);
    expect(plan.changes).toEqual([expect.objectContaining({ type: "remove" })]);
    expect(plan.displacedMinutes).toBe(180);
  });

  it("displaces nothing from blocks that only touch the slot's edges", () => {
    const plan = planSplice({ start: t("2027-01-10T04:00Z"), end: t("2027-01-10T05:00Z") }, [
      block("a", "2027-01-10T01:00Z", "2027-01-10T04:00Z"),
      block("b", "2027-01-10T05:00Z", "2027-01-10T08:00Z"),
    ]);
    expect(plan.changes).toEqual([]);
    expect(plan.displacedMinutes).toBe(0);
  });

  it("handles a slot across midnight UT", () => {
    const plan = planSplice({ start: t("2027-01-10T23:30Z"), end: t("2027-01-11T00:30Z") }, [
      block("a", "2027-01-10T22:00Z", "2027-01-11T00:00Z"),
      block("b", "2027-01-11T00:00Z", "2027-01-11T03:00Z"),
    ]);
    expect(plan.displacements.map((d) => d.minutes)).toEqual([30, 30]);
  });

  it("refuses an empty or reversed slot", () => {
    expect(() => planSplice({ start: 10, end: 10 }, [])).toThrow(InvalidSlotError);
  });
});

describe("splice invariants on random schedules (fast-check)", () => {
  // A night as consecutive blocks of random lengths, and a random slot within it (minutes).
  const schedule = fc
    .array(fc.integer({ min: 15, max: 300 }), { minLength: 1, maxLength: 6 })
    .chain((lengths) => {
      const total = lengths.reduce((a, b) => a + b, 0);
      return fc.record({
        lengths: fc.constant(lengths),
        gaps: fc.array(fc.integer({ min: 0, max: 60 }), { minLength: lengths.length, maxLength: lengths.length }),
        slotStart: fc.integer({ min: -60, max: total + 60 }),
        slotLength: fc.integer({ min: 1, max: 600 }),
      });
    });

  it("never leaves overlaps, and credits exactly the minutes that disappeared", () => {
    fc.assert(
      fc.property(schedule, ({ lengths, gaps, slotStart, slotLength }) => {
        const blocks: SpliceBlock[] = [];
        let cursor = 0;
        lengths.forEach((len, i) => {
          cursor += (gaps[i] ?? 0) * 60_000;
          blocks.push({ id: `b${i}`, start: cursor, end: cursor + len * 60_000, programId: `p${i % 3}`, observerUserId: null });
          cursor += len * 60_000;
        });
        const slot = { start: slotStart * 60_000, end: (slotStart + slotLength) * 60_000 };
        const plan = planSplice(slot, blocks);
        const after = applyPlan(slot, blocks, plan);
        for (let i = 1; i < after.length; i++) expect(after[i]!.start).toBeGreaterThanOrEqual(after[i - 1]!.end);
        const scheduledBefore = blocks.reduce((s, b) => s + (b.end - b.start), 0);
        const scheduledAfter = after.filter((b) => !b.override).reduce((s, b) => s + (b.end - b.start), 0);
        expect(plan.displacedMinutes * 60_000).toBe(scheduledBefore - scheduledAfter);
        for (const d of plan.displacements) expect(d.minutes).toBeGreaterThan(0);
      }),
      { numRuns: 500 },
    );
  });
});
