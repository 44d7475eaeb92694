import { describe, expect, it } from "vitest";
import { findSlots } from "@/lib/slot-finder/find-slots";
import type { FinderBlock, FinderTelescope, SlotFinderInput } from "@/lib/slot-finder/types";

const t = (hhmm: string, day = 10) => Date.parse(`2027-01-${String(day).padStart(2, "0")}T${hhmm}:00Z`);
const iso = (ms: number) => new Date(ms).toISOString().slice(11, 16);

function block(id: string, start: number, end: number, rank: number, kind: FinderBlock["kind"] = "science"): FinderBlock {
  return { id, start, end, kind, programId: `P-${id}`, programCode: id, rank };
}

function scope(code: string, blocks: FinderBlock[], windows = [{ start: t("20:00"), end: t("04:00", 11), bestAt: t("00:00", 11), bestAirmass: 1.2 }], setupMinutes = 10): FinderTelescope {
  return { telescopeId: `id-${code}`, code, setupMinutes, windows, blocks };
}

function input(telescopes: FinderTelescope[], over: Partial<SlotFinderInput> = {}): SlotFinderInput {
  return {
    now: t("12:00"),
    durationMinutes: 60,
    urgency: "within_days",
    horizon: { start: t("12:00"), end: t("12:00", 12) },
    telescopes,
    interruptSetupMinutes: 10,
    ...over,
  };
}

describe("the slot finder on schedules where the right answer is known", () => {
  it("prefers engineering time to a rank-1 program, at a block boundary, and offers a real alternative second", () => {
    const result = findSlots(input([scope("AQ41", [block("SCI-1", t("20:00"), t("00:00", 11), 1), block("ENG", t("00:00", 11), t("04:00", 11), 5, "engineering")])]));
    const [first, second] = result.suggestions;
    expect([iso(first!.start), iso(first!.end)]).toEqual(["00:00", "01:00"]);
    expect(first!.displaced).toEqual([expect.objectContaining({ programCode: "ENG", minutes: 60 })]);
    expect(first!.interrupts).toBeNull();
    expect(first!.displacementCost).toBe(30);
    // The next distinct slot in engineering time ends at the window's end.
    expect([iso(second!.start), iso(second!.end)]).toEqual(["03:00", "04:00"]);
    expect(first!.explanation).toMatch(/^Least displacement: AQ41 starting in 12 h; displaces 60 min of ENG \(engineering time\); mean airmass 1\.20\.$/);
  });

  it("weights displacement by rank: the same hour costs five times more on a rank-1 program than on a rank-5 one", () => {
    const busy = (code: string, rank: number) => scope(code, [block(`${code}-PRG`, t("20:00"), t("04:00", 11), rank)]);
    const result = findSlots(input([busy("HIGH", 1), busy("LOW", 5)]));
    expect(result.suggestions[0]!.telescopeCode).toBe("LOW");
    const costs = (code: string) => result.suggestions.filter((s) => s.telescopeCode === code && !s.interrupts).map((s) => s.displacementCost);
    expect(Math.min(...costs("HIGH"))).toBe(300);
    expect(Math.min(...costs("LOW"))).toBe(60);
  });

  it("puts the cheapest time first: unscheduled, then discretionary or engineering, then science by rank", () => {
    const night = (code: string, b: FinderBlock[]) => scope(code, b);
    const result = findSlots(
      input([
        night("R3", [block("R3-P", t("20:00"), t("04:00", 11), 3)]),
        night("DDT", [block("DDT-P", t("20:00"), t("04:00", 11), 5, "discretionary")]),
        night("FREE", []),
      ]),
    );
    const order = [...new Set(result.suggestions.map((s) => s.telescopeCode))];
    expect(order).toEqual(["FREE", "DDT", "R3"]);
    expect(result.suggestions[0]!.explanation).toContain("displaces nothing (unscheduled time)");
  });

  it("charges setup time for breaking into a block mid-way, at that block's weight", () => {
    // One long rank-2 block: every slot breaks into it except the one at its start.
    const result = findSlots(input([scope("AQ16", [block("SCI-2", t("20:00"), t("04:00", 11), 2)], undefined, 8)], { interruptSetupMinutes: 10 }));
    const atStart = result.suggestions.find((s) => iso(s.start) === "20:00")!;
    const inside = result.suggestions.find((s) => iso(s.start) === "23:30")!;
    expect(atStart.displacementCost).toBe(60 * 4);
    expect(atStart.interrupts).toBeNull();
    // The consortium's 10 min beats the telescope's own 8.
    expect(inside.interrupts).toEqual({ programCode: "SCI-2", setupMinutes: 10, inProgress: false });
    expect(inside.displacementCost).toBe(60 * 4 + 10 * 4);
    expect(inside.explanation).toContain("breaks into SCI-2 (+10 min setup)");
  });

  it("with urgency `now`, starts at now plus setup time, breaking into the block in progress", () => {
    const now = t("22:17") + 30_000;
    const result = findSlots(
      input([scope("AQ41", [block("SCI-3", t("20:00"), t("01:00", 11), 3), block("ENG", t("01:00", 11), t("04:00", 11), 5, "engineering")], undefined, 15)], {
        now,
        urgency: "now",
        horizon: { start: now, end: t("06:00", 11) },
      }),
    );
    const first = result.suggestions[0]!;
    // 22:17:30 + 15 min setup = 22:32:30 → the next whole minute.
    expect([iso(first.start), iso(first.end)]).toEqual(["22:33", "23:33"]);
    expect(first.interrupts).toEqual({ programCode: "SCI-3", setupMinutes: 15, inProgress: true });
    expect(first.explanation).toContain("breaks into SCI-3 while it is observing (+15 min setup)");
    expect(first.strengths).toContain("earliest");
    // Nothing starts sooner than the setup allows.
    expect(result.suggestions.every((s) => s.start >= now + 15 * 60_000)).toBe(true);
  });

  it("never offers a slot that cuts into another override", () => {
    const result = findSlots(input([scope("SO25", [block("TOO-A", t("20:00"), t("23:00"), 1, "too"), block("TOO-B", t("00:00", 11), t("04:00", 11), 1, "too")])]));
    expect(result.suggestions.map((s) => [iso(s.start), iso(s.end)])).toEqual([["23:00", "00:00"]]);
  });

  it("says why when nothing fits: no window long enough, or every window taken by overrides", () => {
    const short = findSlots(input([scope("AQ41", [], [{ start: t("20:00"), end: t("20:45"), bestAt: t("20:20"), bestAirmass: 1.5 }])]));
    expect(short.suggestions).toEqual([]);
    expect(short.reason).toBe("No observable window of 60 min is left on any acceptable telescope before the deadline.");
    const taken = findSlots(input([scope("AQ41", [block("TOO", t("19:00"), t("05:00", 11), 1, "too")])]));
    expect(taken.reason).toMatch(/overlaps another override/);
  });

  it("keeps inside the usable time: after the deadline nothing is offered", () => {
    const result = findSlots(input([scope("AQ41", [])], { horizon: { start: t("12:00"), end: t("21:30") } }));
    expect(result.suggestions.every((s) => s.end <= t("21:30"))).toBe(true);
    // 20:00 and 20:30 overlap by exactly half the duration: still distinct enough to offer both.
    expect(result.suggestions.map((s) => iso(s.start))).toEqual(["20:00", "20:30"]);
  });

  it("offers no slot that ends after the target fades past the instrument's limit, and says why", () => {
    const fade = { at: t("23:00"), alreadyFainter: false, limit: "CAM's limit V 21.0", magnitudeAtStart: 20.2 };
    const result = findSlots(input([scope("AQ41", []), scope("SO25", [block("SCI", t("20:00"), t("04:00", 11), 2)])], { fade }));
    expect(result.suggestions.length).toBeGreaterThan(0);
    for (const s of result.suggestions) expect(s.end).toBeLessThanOrEqual(fade.at);
    expect(result.suggestions.map((s) => iso(s.end))).toContain("23:00");
    expect(result.reason).toBeNull();
    expect(result.note).toBe("No slot is offered after 2027-01-10 23:00 UT, when the target fades past CAM's limit V 21.0: later slots cannot reach it.");

    // Faded before an hour of the window has passed: nothing, and the reason names the fade, not the deadline.
    const late = findSlots(input([scope("AQ41", [])], { fade: { ...fade, at: t("20:45") } }));
    expect(late.suggestions).toEqual([]);
    expect(late.reason).toBe("No observable window of 60 min is left on any acceptable telescope before the target fades past CAM's limit V 21.0 at 2027-01-10 20:45 UT; later slots cannot reach it.");

    const faint = findSlots(input([scope("AQ41", [])], { fade: { ...fade, at: t("12:00"), alreadyFainter: true, magnitudeAtStart: 22.34 } }));
    expect(faint.suggestions).toEqual([]);
    expect(faint.reason).toBe("The target is already fainter than CAM's limit V 21.0 (predicted V 22.3): no slot can reach it, so none is offered.");

    // A fade after the usable time ends changes nothing.
    const after = findSlots(input([scope("AQ41", [])], { fade: { ...fade, at: t("13:00", 12) } }));
    expect(after.note).toBeNull();
    expect(after.suggestions).toEqual(findSlots(input([scope("AQ41", [])])).suggestions);
  });

  it("centres the slot on the best airmass when time is free and urgency allows", () => {
    // Airmass falls from 2.0 at 20:00 to 1.05 at 02:00 and rises again.
    const samples = [];
    for (let m = 0; m <= 8 * 60; m += 10) {
      const at = t("20:00") + m * 60_000;
      samples.push({ t: at, airmass: 1.05 + 0.95 * Math.abs(m - 360) / 360 });
    }
    const free = { ...scope("AQ41", [], [{ start: t("20:00"), end: t("04:00", 11), bestAt: t("02:00", 11), bestAirmass: 1.05 }]), airmass: samples };
    const result = findSlots(input([free]));
    expect([iso(result.suggestions[0]!.start), iso(result.suggestions[0]!.end)]).toEqual(["01:30", "02:30"]);
    expect(result.suggestions[0]!.strengths).toContain("airmass");
    expect(result.suggestions[0]!.airmass).toBeCloseTo(1.05 + (0.95 * (120 / 7)) / 360, 6);
    // With urgency `now` the earliest slot wins instead.
    const urgent = findSlots(input([free], { urgency: "now", now: t("19:50"), horizon: { start: t("19:50"), end: t("06:00", 11) } }));
    expect(iso(urgent.suggestions[0]!.start)).toBe("20:00");
  });

  it("prefers tonight's rank-5 hour to an engineering hour three nights later when the request is for tonight", () => {
    const lateWindow = { start: t("20:00", 13), end: t("04:00", 14), bestAt: t("00:00", 14), bestAirmass: 1.2 };
    const tonightWindow = { start: t("20:00"), end: t("04:00", 11), bestAt: t("00:00", 11), bestAirmass: 1.2 };
    const telescope = scope("AQ41", [block("R5", t("20:00"), t("04:00", 11), 5), block("ENG", t("20:00", 13), t("04:00", 14), 5, "engineering")], [tonightWindow, lateWindow]);
    const horizon = { start: t("12:00"), end: t("12:00", 15) };
    expect(findSlots(input([telescope], { urgency: "tonight", horizon })).suggestions[0]!.displaced[0]!.programCode).toBe("R5");
  });
});
