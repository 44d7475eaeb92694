// Edge cases of nights and windows. Expected behaviour is geometric (a target's extreme
// altitudes are 90° − |φ − δ| and −90° + |φ + δ|); event times are checked against
// astronomy-engine where one exists.

import * as AE from "astronomy-engine";
import { describe, expect, it } from "vitest";
import {
  Ephemeris,
  formatLocalIso,
  nightEvents,
  nightOfInstant,
  nightsBetween,
  nightSpan,
  planNight,
  type PlanRequest,
  type Site,
} from "@/lib/sky";

const telescope = { minAltitudeDeg: 20, sunAvoidanceDeg: 30 };
const HOUR = 3_600_000;

function request(
  site: Site,
  raDeg: number,
  decDeg: number,
  darkness: "civil" | "nautical" | "astronomical" = "astronomical",
): PlanRequest {
  return { site, target: { kind: "fixed", raDeg, decDeg }, telescope, constraints: { darkness } };
}

const chile: Site = { latitudeDeg: -30.17, longitudeDeg: -70.8, heightM: 2200, timeZone: "America/Santiago" };
const arctic: Site = { latitudeDeg: 78.2, longitudeDeg: 15.6, heightM: 10, timeZone: "Arctic/Longyearbyen" };

describe("targets that never rise and targets that never set", () => {
  it("a far-southern target from a northern site has no windows and no error", () => {
    const site: Site = { latitudeDeg: 45, longitudeDeg: 10, heightM: 500, timeZone: "Europe/Rome" };
    const plan = planNight(request(site, 90, -60), "2025-01-10");
    expect(plan.windows).toEqual([]);
    expect(plan.observableMinutes).toBe(0);
    expect(plan.bestAirmass).toBeNull();
  });

  it("a target that culminates below the altitude limit has no windows", () => {
    // Max altitude 90 − |45 − (−27)| = 18° < 20° limit.
    const site: Site = { latitudeDeg: 45, longitudeDeg: 10, heightM: 500, timeZone: "Europe/Rome" };
    expect(planNight(request(site, 90, -27), "2025-01-10").windows).toEqual([]);
    expect(planNight(request(site, 90, -24), "2025-01-10").windows.length).toBe(1);
  });

  it("a circumpolar target is observable through the whole dark interval", () => {
    const site: Site = { latitudeDeg: 60, longitudeDeg: 25, heightM: 100, timeZone: "Europe/Helsinki" };
    const plan = planNight(request(site, 37.95, 89.26), "2025-01-10"); // near the celestial pole
    expect(plan.windows).toHaveLength(1);
    expect(plan.windows[0]!.start).toBe(plan.dark[0]!.start);
    expect(plan.windows[0]!.end).toBe(plan.dark[0]!.end);
    expect(plan.bestAltitudeDeg!).toBeGreaterThan(60);
  });
});

describe("a site above the polar circle", () => {
  it("midsummer: the Sun never sets — every event is null and there is no dark time", () => {
    const ev = nightEvents(arctic, "2025-06-21");
    for (const k of [
      "sunset",
      "civilDusk",
      "nauticalDusk",
      "astronomicalDusk",
      "astronomicalDawn",
      "nauticalDawn",
      "civilDawn",
      "sunrise",
    ] as const) {
      expect(ev[k]).toBeNull();
    }
    // Lowest altitude = δ☉ − (90° − φ) = 23.44° − 11.8° ≈ +11.6°.
    expect(ev.sunAltitudeAtMidnightDeg).toBeCloseTo(23.44 - (90 - 78.2), 1);
    expect(AE.SearchRiseSet(AE.Body.Sun, new AE.Observer(78.2, 15.6, 10), -1, new Date(ev.start), 1)).toBeNull();
    expect(planNight(request(arctic, 0, 80, "civil"), "2025-06-21").windows).toEqual([]);
  });

  it("midwinter: no sunset or civil twilight, but nautical and astronomical twilight happen", () => {
    const ev = nightEvents(arctic, "2025-12-21");
    expect(ev.sunset).toBeNull();
    expect(ev.sunrise).toBeNull();
    expect(ev.civilDusk).toBeNull();
    expect(ev.civilDawn).toBeNull();
    const observer = new AE.Observer(78.2, 15.6, 10);
    const dusk = AE.SearchAltitude(AE.Body.Sun, observer, -1, new Date(ev.start), 1, -12)!;
    expect(Math.abs(ev.nauticalDusk! - dusk.date.getTime())).toBeLessThan(60_000);
    const dawn = AE.SearchAltitude(AE.Body.Sun, observer, 1, new Date(ev.start), 1, -18)!;
    expect(Math.abs(ev.astronomicalDawn! - dawn.date.getTime())).toBeLessThan(60_000);
    // Civil darkness all day: a circumpolar target is observable for the whole 24 h night.
    const plan = planNight(request(arctic, 0, 80, "civil"), "2025-12-21");
    expect(plan.windows).toHaveLength(1);
    expect(plan.windows[0]!.durationMinutes).toBeCloseTo(24 * 60, 6);
  });

  it("a mid-latitude summer night where astronomical twilight never ends", () => {
    const site: Site = { latitudeDeg: 55, longitudeDeg: 0, heightM: 0, timeZone: "Europe/London" };
    const ev = nightEvents(site, "2025-06-21");
    expect(ev.sunset).not.toBeNull();
    expect(ev.civilDusk).not.toBeNull();
    expect(ev.nauticalDusk).toBeNull();
    expect(ev.astronomicalDusk).toBeNull();
    expect(ev.astronomicalDawn).toBeNull();
    expect(planNight(request(site, 270, 60, "astronomical"), "2025-06-21").windows).toEqual([]);
    expect(planNight(request(site, 270, 60, "civil"), "2025-06-21").windows).toHaveLength(1);
  });
});

describe("a site at the pole", () => {
  it("has no rise or set, and darkness follows the Sun's declination", () => {
    const pole: Site = { latitudeDeg: 90, longitudeDeg: 0, heightM: 2800 };
    const spring = nightEvents(pole, "2025-04-15"); // Sun ~10° up all day
    expect(spring.sunset).toBeNull();
    expect(spring.civilDusk).toBeNull();
    expect(planNight(request(pole, 0, 45, "civil"), "2025-04-15").dark).toEqual([]);
    const winter = planNight(request(pole, 0, 45, "astronomical"), "2025-12-21"); // Sun ~23° down
    expect(winter.dark).toHaveLength(1);
    expect(winter.windows).toHaveLength(1);
    expect(winter.windows[0]!.durationMinutes).toBeCloseTo(24 * 60, 6);
  });
});

describe("windows across 0h UT and the local date line", () => {
  it("a window crossing 0h UT is one window, not two", () => {
    const plan = planNight(request(chile, 210, -30), "2025-06-15");
    expect(plan.windows).toHaveLength(1);
    const w = plan.windows[0]!;
    const midnightUt = Date.UTC(2025, 5, 16);
    expect(w.start).toBeLessThan(midnightUt);
    expect(w.end).toBeGreaterThan(midnightUt);
  });

  it("a window crossing local midnight is one window, named by the evening's date", () => {
    const plan = planNight(request(chile, 210, -30), "2025-06-15");
    const w = plan.windows[0]!;
    expect(formatLocalIso(w.start, chile.timeZone!).slice(0, 10)).toBe("2025-06-15");
    expect(formatLocalIso(w.end, chile.timeZone!).slice(0, 10)).toBe("2025-06-16");
    expect(nightOfInstant(chile, w.end).nightOf).toBe("2025-06-15");
  });

  it.each([
    ["Pacific/Kiritimati", 1.87, -157.4], // UTC+14 at a western longitude: civil date ≈ solar date + 1
    ["Pacific/Fiji", -17.7, 178.0],
    ["Pacific/Pago_Pago", -14.3, -170.7], // UTC−11 just east of the date line
    ["Pacific/Auckland", -43.99, 170.46],
  ])("%s: the night of a date starts on that local date, around local noon", (timeZone, lat, lon) => {
    const site: Site = { latitudeDeg: lat, longitudeDeg: lon, heightM: 0, timeZone };
    const span = nightSpan(site, "2025-06-15");
    const local = formatLocalIso(span.start, timeZone);
    expect(local.slice(0, 10)).toBe("2025-06-15");
    const hour = Number(local.slice(11, 13));
    expect(hour).toBeGreaterThanOrEqual(9);
    expect(hour).toBeLessThanOrEqual(15);
    const plan = planNight(request(site, 270, -20), "2025-06-15");
    expect(plan.windows.length).toBeGreaterThan(0);
    for (const w of plan.windows) expect(nightOfInstant(site, w.start).nightOf).toBe("2025-06-15");
    expect(span.end - span.start).toBe(24 * HOUR);
  });
});

describe("a daylight-saving change at the site", () => {
  const canary: Site = { latitudeDeg: 28.76, longitudeDeg: -17.88, heightM: 2300, timeZone: "Atlantic/Canary" };
  it("nights stay contiguous, 24 h long and consecutively named across the change", () => {
    const nights = nightsBetween(canary, "2025-03-27", "2025-04-02"); // clocks go forward 2025-03-30 01:00 UTC
    expect(nights.map((n) => n.nightOf)).toEqual([
      "2025-03-27",
      "2025-03-28",
      "2025-03-29",
      "2025-03-30",
      "2025-03-31",
      "2025-04-01",
      "2025-04-02",
    ]);
    for (let i = 1; i < nights.length; i++) expect(nights[i]!.start).toBe(nights[i - 1]!.end);
    for (const n of nights) expect(n.end - n.start).toBe(24 * HOUR);
  });

  it("the night spanning the change shows both offsets and its window changes smoothly", () => {
    const span = nightSpan(canary, "2025-03-29");
    expect(formatLocalIso(span.start, canary.timeZone!)).toMatch(/\+00:00$/);
    expect(formatLocalIso(span.end, canary.timeZone!)).toMatch(/\+01:00$/);
    const durations = ["2025-03-28", "2025-03-29", "2025-03-30"].map(
      (d) => planNight(request(canary, 150, 20), d).observableMinutes,
    );
    // Daily change of a few minutes, no 60-minute jump from the clock change.
    expect(Math.abs(durations[1]! - durations[0]!)).toBeLessThan(10);
    expect(Math.abs(durations[2]! - durations[1]!)).toBeLessThan(10);
    const ev = nightEvents(canary, "2025-03-30");
    expect(formatLocalIso(ev.sunset!, canary.timeZone!)).toMatch(/T20:2\d:\d\d\+01:00$/);
  });
});

describe("RA wrap in ephemeris interpolation", () => {
  const t0 = Date.UTC(2030, 0, 1);
  // Uniform motion through 0h: 0.4° per hour in RA at Dec +10°.
  const rows = [-0.5, -0.1, 0.3, 0.7, 1.1].map((ra, i) => ({
    time: t0 + i * HOUR,
    raDeg: (ra + 360) % 360,
    decDeg: 10,
  }));
  const ephemeris = new Ephemeris(rows);

  it("interpolates across 0h/24h without swinging through 12h", () => {
    const mid = ephemeris.at(t0 + 1.5 * HOUR)!;
    expect(mid.raDeg).toBeCloseTo(0.1, 3);
    expect(mid.decDeg).toBeCloseTo(10, 3);
    const before = ephemeris.at(t0 + 1.25 * HOUR)!;
    expect(before.raDeg).toBeCloseTo(359.9 + 0.1, 3);
  });

  it("moves smoothly and monotonically through the seam", () => {
    let previous = -Infinity;
    for (let t = t0; t <= t0 + 4 * HOUR; t += 60_000) {
      const ra = ephemeris.at(t)!.raDeg;
      const unwrapped = ra > 180 ? ra - 360 : ra;
      expect(unwrapped).toBeGreaterThan(previous);
      previous = unwrapped;
    }
  });

  it("does not extrapolate outside the table", () => {
    expect(ephemeris.at(t0 - 1)).toBeNull();
    expect(ephemeris.at(t0 + 4 * HOUR + 1)).toBeNull();
  });
});
