// The airmass chart's time axis: ticks on whole UT hours, never drifting off them.
import { describe, expect, it } from "vitest";
import { hourTicks } from "@/components/requests/airmass-chart";

const at = (iso: string) => Date.parse(iso);
const clock = (t: number) => new Date(t).toISOString().slice(11, 16);

describe("hourTicks", () => {
  it("puts a long night's ticks on every second whole UT hour", () => {
    const ticks = hourTicks(at("2026-12-01T22:37:00Z"), at("2026-12-02T10:13:00Z"));
    expect(ticks.map(clock)).toEqual(["00:00", "02:00", "04:00", "06:00", "08:00", "10:00"]);
  });

  it("ticks every hour on a short night, from the first whole hour inside it", () => {
    const ticks = hourTicks(at("2027-06-20T21:05:00Z"), at("2027-06-21T04:50:00Z"));
    expect(ticks.map(clock)).toEqual(["22:00", "23:00", "00:00", "01:00", "02:00", "03:00", "04:00"]);
  });
});
