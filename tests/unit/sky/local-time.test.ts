// The engine's UTC offsets (kept per zone and hour) against luxon's, an independent
// implementation over the same IANA data, through a whole year of DST changes: a
// whole-hour change (Madrid), one at local midnight (Santiago), a half-hour change (Lord
// Howe) and a zone without DST at +05:45 (Kathmandu).
import { DateTime } from "luxon";
import { describe, expect, it } from "vitest";
import { formatLocalIso, timeZoneOffsetMs } from "@/lib/sky/local-time";

const ZONES = ["Europe/Madrid", "America/Santiago", "Australia/Lord_Howe", "Asia/Kathmandu"];
const luxonOffsetMs = (zone: string, t: number) => DateTime.fromMillis(t, { zone }).offset * 60_000;

describe("UTC offsets of site time zones", () => {
  it.each(ZONES)("match luxon every 7 min 13 s through 2027 in %s, and to the second around each change", (zone) => {
    const start = Date.UTC(2027, 0, 1);
    const end = Date.UTC(2028, 0, 1);
    const changes: number[] = [];
    let previous = luxonOffsetMs(zone, start);
    for (let t = start; t < end; t += 433_000) {
      const expected = luxonOffsetMs(zone, t);
      expect(timeZoneOffsetMs(zone, t)).toBe(expected);
      if (expected !== previous) changes.push(t);
      previous = expected;
    }
    expect(changes.length).toBe(zone === "Asia/Kathmandu" ? 0 : 2);
    for (const near of changes) {
      for (let t = near - 433_000; t <= near + 1000; t += 1000) expect(timeZoneOffsetMs(zone, t)).toBe(luxonOffsetMs(zone, t));
    }
  });

  it("writes local times with the offset in force at that instant", () => {
    // Madrid springs forward at 01:00 UT on 2027-03-28.
    expect(formatLocalIso(Date.UTC(2027, 2, 28, 0, 59, 59), "Europe/Madrid")).toBe("2027-03-28T01:59:59+01:00");
    expect(formatLocalIso(Date.UTC(2027, 2, 28, 1, 0, 0), "Europe/Madrid")).toBe("2027-03-28T03:00:00+02:00");
    expect(formatLocalIso(Date.UTC(2027, 5, 1, 12, 0, 0), "Asia/Kathmandu")).toBe("2027-06-01T17:45:00+05:45");
  });
});
