import { describe, expect, it } from "vitest";
import { formatDuration, formatLocal, formatUt, localDate } from "@/lib/time/format";

describe("showing instants in UT and site time", () => {
  it("gives a block across the spring DST change in Madrid the right local times", () => {
    // Clocks in Europe/Madrid go from 02:00 CET to 03:00 CEST at 01:00 UT on the last Sunday of March (2027-03-28).
    const start = new Date("2027-03-27T23:00:00Z");
    const end = new Date("2027-03-28T03:00:00Z");
    expect(formatUt(start)).toBe("2027-03-27 23:00");
    expect(formatLocal(start, "Europe/Madrid")).toBe("2027-03-28 00:00 CET");
    expect(formatLocal(end, "Europe/Madrid")).toBe("2027-03-28 05:00 CEST");
    // Four hours of UT are four hours of observing, though the local clock moved five.
    expect((end.getTime() - start.getTime()) / 3_600_000).toBe(4);
  });

  it("handles the southern autumn change at a Chilean site (clocks go back)", () => {
    // America/Santiago leaves summer time (UTC−3 → UTC−4) on the first Sunday of April: 2027-04-04 at 03:00 UT.
    expect(formatLocal(new Date("2027-04-04T02:30:00Z"), "America/Santiago")).toBe("2027-04-03 23:30 GMT-3");
    expect(formatLocal(new Date("2027-04-04T03:30:00Z"), "America/Santiago")).toBe("2027-04-03 23:30 GMT-4");
  });

  it("names the local date of an instant, which can differ from the UT date", () => {
    expect(localDate(new Date("2027-01-10T02:00:00Z"), "America/Santiago")).toBe("2027-01-09");
    expect(localDate(new Date("2027-01-10T02:00:00Z"), "Europe/Madrid")).toBe("2027-01-10");
  });

  it("formats durations", () => {
    expect(formatDuration(45)).toBe("45 min");
    expect(formatDuration(135)).toBe("2 h 15 min");
  });
});
