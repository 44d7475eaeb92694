import { describe, expect, it } from "vitest";
import { formatZonedIso, isKnownTimeZone, utcOffsetMinutes, zonedToUtc } from "@/lib/schedule/import/zoned-time";

const wall = (s: string) => {
  const [d = "", t = ""] = s.split(" ");
  const [year, month, day] = d.split("-").map(Number);
  const [hour, minute] = t.split(":").map(Number);
  return { year: year ?? 0, month: month ?? 0, day: day ?? 0, hour: hour ?? 0, minute: minute ?? 0, second: 0 };
};

describe("wall-clock times at a site", () => {
  // Source: EU Directive 2000/84/EC, art. 2–3 — summer time starts at 01:00 UTC on the last
  // Sunday of March and ends at 01:00 UTC on the last Sunday of October (28 Mar and 31 Oct 2027).
  it("reads Madrid times either side of the March change with the right offsets", () => {
    expect(zonedToUtc(wall("2027-03-28 01:30"), "Europe/Madrid")).toEqual({ ok: true, instant: new Date("2027-03-28T00:30:00Z") });
    expect(zonedToUtc(wall("2027-03-28 03:30"), "Europe/Madrid")).toEqual({ ok: true, instant: new Date("2027-03-28T01:30:00Z") });
    expect(zonedToUtc(wall("2027-03-28 02:30"), "Europe/Madrid")).toEqual({ ok: false, reason: "nonexistent" });
  });

  it("refuses a Madrid time that happens twice in October, naming both offsets", () => {
    expect(zonedToUtc(wall("2027-10-31 02:30"), "Europe/Madrid")).toEqual({ ok: false, reason: "ambiguous", offsets: [120, 60] });
    expect(zonedToUtc(wall("2027-10-31 03:30"), "Europe/Madrid")).toEqual({ ok: true, instant: new Date("2027-10-31T02:30:00Z") });
  });

  // Source: IANA tz database, file `southamerica`, Rule Chile: standard time from the first
  // Sunday on or after 2 April at 03:00 UTC, summer time from the first Sunday on or after
  // 2 September at 04:00 UTC (4 Apr and 5 Sep 2027).
  it("handles Santiago's April and September changes", () => {
    expect(zonedToUtc(wall("2027-04-03 22:30"), "America/Santiago")).toEqual({ ok: true, instant: new Date("2027-04-04T01:30:00Z") });
    expect(zonedToUtc(wall("2027-04-03 23:30"), "America/Santiago")).toEqual({ ok: false, reason: "ambiguous", offsets: [-180, -240] });
    expect(zonedToUtc(wall("2027-04-04 00:30"), "America/Santiago")).toEqual({ ok: true, instant: new Date("2027-04-04T04:30:00Z") });
    expect(zonedToUtc(wall("2027-09-05 00:30"), "America/Santiago")).toEqual({ ok: false, reason: "nonexistent" });
    expect(zonedToUtc(wall("2027-09-05 01:30"), "America/Santiago")).toEqual({ ok: true, instant: new Date("2027-09-05T04:30:00Z") });
  });

  it("formats an instant as the site's wall clock with its offset", () => {
    expect(formatZonedIso(new Date("2027-03-28T00:30:00Z"), "Europe/Madrid")).toBe("2027-03-28T01:30:00+01:00");
    expect(formatZonedIso(new Date("2027-03-28T01:30:00Z"), "Europe/Madrid")).toBe("2027-03-28T03:30:00+02:00");
    expect(formatZonedIso(new Date("2027-04-04T03:30:00Z"), "America/Santiago")).toBe("2027-04-03T23:30:00-04:00");
    expect(formatZonedIso(new Date("2027-01-01T05:45:00Z"), "Asia/Kathmandu")).toBe("2027-01-01T11:30:00+05:45");
    expect(utcOffsetMinutes(new Date("2027-07-01T00:00:00Z"), "UTC")).toBe(0);
  });

  it("knows IANA names and nothing else", () => {
    expect(isKnownTimeZone("America/Santiago")).toBe(true);
    expect(isKnownTimeZone("UTC")).toBe(true);
    expect(isKnownTimeZone("Mars/Olympus_Mons")).toBe(false);
    expect(isKnownTimeZone("")).toBe(false);
  });
});
