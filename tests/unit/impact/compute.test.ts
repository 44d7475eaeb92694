import { describe, expect, it } from "vitest";
import { computeImpact, type ImpactBlock } from "@/lib/impact/compute";

const t = (iso: string) => Date.parse(`2027-01-10T${iso}:00Z`);

function block(id: string, start: string, end: string, over: Partial<ImpactBlock> = {}): ImpactBlock {
  return {
    id,
    start: t(start),
    end: t(end),
    kind: "science",
    programId: `prog-${id}`,
    programCode: `SCI-${id}`,
    programTitle: `Program ${id}`,
    programRank: 2,
    observerUserId: `obs-${id}`,
    observerName: `Observer ${id}`,
    observerEmail: `${id}@example.test`,
    ...over,
  };
}

describe("the impact of a slot", () => {
  it("lists every overlapped block with how it changes, minutes lost and owed, per program and per observer", () => {
    const blocks = [
      block("a", "00:00", "02:00"),
      block("b", "02:00", "05:00", { observerUserId: "obs-a", observerName: "Observer a", observerEmail: "a@example.test" }),
      block("c", "05:00", "08:00", { programId: "prog-a", programCode: "SCI-a", programTitle: "Program a" }),
      block("far", "09:00", "10:00"),
    ];
    const impact = computeImpact({ start: t("01:30"), end: t("05:30") }, blocks, 1);
    expect(impact.blocks.map((b) => [b.blockId, b.change, b.minutes, b.owedMinutes])).toEqual([
      ["a", "trim-end", 30, 30],
      ["b", "remove", 180, 180],
      ["c", "trim-start", 30, 30],
    ]);
    expect(impact.displacedMinutes).toBe(240);
    expect(impact.slotMinutes).toBe(240);
    expect(impact.byProgram.map((p) => [p.programCode, p.minutes, p.owedMinutes])).toEqual([
      ["SCI-b", 180, 180],
      ["SCI-a", 60, 60],
    ]);
    expect(impact.byObserver.map((o) => [o.observerName, o.minutes])).toEqual([
      ["Observer a", 210],
      ["Observer c", 30],
    ]);
    expect(impact.blockedBy).toEqual([]);
  });

  it("applies the credit ratio to what is owed", () => {
    const impact = computeImpact({ start: t("01:00"), end: t("02:00") }, [block("a", "00:00", "04:00")], 2);
    expect(impact.blocks[0]).toMatchObject({ change: "split", minutes: 60, owedMinutes: 120, lostStart: t("01:00"), lostEnd: t("02:00") });
    expect(impact.owedMinutes).toBe(120);
    expect(impact.creditRatio).toBe(2);
  });

  it("displaces nothing from blocks that only touch the slot, and gathers observer-less blocks under one line", () => {
    const blocks = [block("a", "00:00", "01:00"), block("e1", "01:00", "02:00", { kind: "engineering", observerUserId: null, observerName: null, observerEmail: null }), block("e2", "02:00", "03:00", { kind: "engineering", observerUserId: null, observerName: null, observerEmail: null }), block("d", "03:00", "04:00")];
    const impact = computeImpact({ start: t("01:00"), end: t("03:00") }, blocks, 1);
    expect(impact.blocks.map((b) => b.blockId)).toEqual(["e1", "e2"]);
    expect(impact.byObserver).toEqual([{ observerUserId: null, observerName: null, observerEmail: null, minutes: 120, owedMinutes: 120 }]);
  });

  it("reports a slot touching another override as blocked and plans nothing for it", () => {
    const impact = computeImpact({ start: t("01:00"), end: t("03:00") }, [block("a", "00:00", "02:00"), block("too", "02:00", "04:00", { kind: "too", programCode: "TOO-01" })], 1);
    expect(impact.blockedBy).toEqual([{ blockId: "too", programCode: "TOO-01", start: t("02:00"), end: t("04:00") }]);
    expect(impact.blocks).toEqual([]);
    expect(impact.displacedMinutes).toBe(0);
  });

  it("handles a slot across midnight UT", () => {
    const start = Date.parse("2027-01-10T23:00:00Z");
    const end = Date.parse("2027-01-11T00:30:00Z");
    const b = { ...block("m", "22:00", "23:59"), end: Date.parse("2027-01-11T02:00:00Z") };
    const impact = computeImpact({ start, end }, [b], 1);
    expect(impact.blocks[0]).toMatchObject({ change: "split", minutes: 90 });
  });
});
