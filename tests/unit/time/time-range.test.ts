// TimeRange, the UT-over-local pair used in every table: the end's date is implied on the
// same day, marked "+1" (before the zone, never after it) on the next, written out beyond.
import { createElement as h } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { TimeRange } from "@/components/time/time-range";

const text = (start: string, end: string, timeZone = "America/Santiago") =>
  renderToStaticMarkup(h(TimeRange, { start: new Date(start), end: new Date(end), timeZone }))
    .replace(/<sup>\+1<\/sup>/g, "⁺¹")
    .replace(/<[^>]+>/g, "|")
    .replace(/\|+/g, "|");

describe("TimeRange", () => {
  it("gives only the end's clock on the same date, in UT and at the site", () => {
    expect(text("2027-01-10T01:00:00Z", "2027-01-10T03:30:00Z")).toBe("|2027-01-10 01:00|–|03:30| UT|2027-01-09 22:00–00:30⁺¹ GMT-3 local|");
  });

  it("marks the next date with +1 before the zone", () => {
    expect(text("2027-01-10T22:00:00Z", "2027-01-11T05:00:00Z")).toBe("|2027-01-10 22:00|–|05:00⁺¹| UT|2027-01-10 19:00–02:00⁺¹ GMT-3 local|");
  });

  it("writes out the end's date when the range spans more than one night", () => {
    expect(text("2026-12-02T05:00:00Z", "2026-12-05T05:00:00Z")).toBe("|2026-12-02 05:00|–|2026-12-05 05:00| UT|2026-12-02 02:00–2026-12-05 02:00 GMT-3 local|");
  });

  it("names both zones when the site's clocks change within the range", () => {
    // Madrid leaves summer time at 01:00 UT on 2027-10-31.
    expect(text("2027-10-30T22:00:00Z", "2027-10-31T04:00:00Z", "Europe/Madrid")).toBe("|2027-10-30 22:00|–|04:00⁺¹| UT|2027-10-31 00:00 CEST–05:00 CET local|");
  });
});
