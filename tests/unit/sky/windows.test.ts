// The window finder against brute force: every minute of the night checked one instant at a
// time with the engine's own one-off position functions (and, for one night, with
// astronomy-engine). Edges must agree within one minute — the brute force's resolution.

import * as AE from "astronomy-engine";
import { describe, expect, it } from "vitest";
import {
  angularSeparationDeg,
  DARKNESS_SUN_ALTITUDE,
  Ephemeris,
  fixedTargetPosition,
  type Interval,
  moonPositionFrom,
  nightSpan,
  Planner,
  planNight,
  type PlanRequest,
  type Site,
  sunPositionFrom,
} from "@/lib/sky";
import { altitudeForAirmass } from "@/lib/sky";
import { seededRandom } from "./helpers";

const MINUTE = 60_000;

function bruteForce(req: PlanRequest, nightOf: string, ok: (t: number) => boolean): Interval[] {
  const span = nightSpan(req.site, nightOf);
  const out: Interval[] = [];
  let open: number | null = null;
  for (let t = span.start; t <= span.end; t += MINUTE) {
    const good = ok(t);
    if (good && open === null) open = t;
    if (!good && open !== null) {
      out.push({ start: open, end: t });
      open = null;
    }
  }
  if (open !== null) out.push({ start: open, end: span.end });
  return out;
}

function expectSameWindows(found: Interval[], expected: Interval[], toleranceMs: number): void {
  expect(found.map((w) => [w.start, w.end]).length).toBe(expected.length);
  found.forEach((w, i) => {
    expect(Math.abs(w.start - expected[i]!.start)).toBeLessThanOrEqual(toleranceMs);
    expect(Math.abs(w.end - expected[i]!.end)).toBeLessThanOrEqual(toleranceMs);
  });
}

describe("fixed-target windows equal a minute-by-minute brute force", () => {
  const random = seededRandom(7);
  const cases = Array.from({ length: 24 }, (_, i) => {
    const site: Site = { latitudeDeg: -60 + 120 * random(), longitudeDeg: -180 + 360 * random(), heightM: 2000 };
    const day = new Date(Date.UTC(2024, 0, 1) + Math.floor(random() * 730) * 86_400_000).toISOString().slice(0, 10);
    const raDeg = 360 * random();
    const decDeg = -70 + 140 * random();
    const minAltitudeDeg = 15 + 25 * random();
    const ha = i % 3 === 0 ? { min: -3 - 2 * random(), max: 3 + 2 * random() } : undefined;
    const darkness = (["civil", "nautical", "astronomical"] as const)[i % 3]!;
    const req: PlanRequest = {
      site,
      target: { kind: "fixed", raDeg, decDeg },
      telescope: { minAltitudeDeg, hourAngleHours: ha, sunAvoidanceDeg: 40 },
      constraints: { darkness, maxAirmass: i % 2 === 0 ? 2.5 : undefined },
    };
    return { req, day };
  });

  it.each(cases.map((c, i) => [i, c] as const))("case %i", (_, { req, day }) => {
    const target = req.target as { raDeg: number; decDeg: number };
    const minAlt = Math.max(
      req.telescope.minAltitudeDeg,
      req.constraints.maxAirmass ? altitudeForAirmass(req.constraints.maxAirmass) : 0,
    );
    const darkAlt = DARKNESS_SUN_ALTITUDE[req.constraints.darkness];
    const ha = req.telescope.hourAngleHours;
    const expected = bruteForce(req, day, (t) => {
      const p = fixedTargetPosition(target.raDeg, target.decDeg, req.site, t);
      const sun = sunPositionFrom(req.site, t);
      if (sun.altitudeDeg > darkAlt || p.altitudeDeg < minAlt) return false;
      if (ha && (p.hourAngleDeg / 15 < ha.min || p.hourAngleDeg / 15 > ha.max)) return false;
      return angularSeparationDeg(p.raDeg, p.decDeg, sun.raDeg, sun.decDeg) >= req.telescope.sunAvoidanceDeg;
    });
    expectSameWindows(planNight(req, day).windows, expected, MINUTE);
  });
});

describe("one night against astronomy-engine evaluated naively, minute by minute", () => {
  it("gives the same window edges within a minute", () => {
    const site: Site = { latitudeDeg: -29.26, longitudeDeg: -70.73, heightM: 2400, timeZone: "America/Santiago" };
    const req: PlanRequest = {
      site,
      target: { kind: "fixed", raDeg: 201.365, decDeg: -43.019 },
      telescope: { minAltitudeDeg: 25, sunAvoidanceDeg: 45 },
      constraints: { darkness: "nautical" },
    };
    const observer = new AE.Observer(site.latitudeDeg, site.longitudeDeg, site.heightM);
    AE.DefineStar(AE.Body.Star1, 201.365 / 15, -43.019, 1e6);
    const expected = bruteForce(req, "2025-05-20", (t) => {
      const date = new Date(t);
      const s = AE.Equator(AE.Body.Sun, date, observer, true, true);
      if (AE.Horizon(date, observer, s.ra, s.dec).altitude > -12) return false;
      const e = AE.Equator(AE.Body.Star1, date, observer, true, true);
      return AE.Horizon(date, observer, e.ra, e.dec).altitude >= 25;
    });
    expectSameWindows(planNight(req, "2025-05-20").windows, expected, MINUTE);
  });
});

describe("moving targets", () => {
  const site: Site = { latitudeDeg: 19.82, longitudeDeg: -155.47, heightM: 4200, timeZone: "Pacific/Honolulu" };

  it("an ephemeris that does not move gives the fixed target's windows (within seconds)", () => {
    const t0 = Date.UTC(2025, 9, 1);
    const rows = Array.from({ length: 20 }, (_, i) => ({ time: t0 + i * 86_400_000, raDeg: 10.68, decDeg: 41.27 }));
    const base = {
      site,
      telescope: { minAltitudeDeg: 30, sunAvoidanceDeg: 40 },
      constraints: { darkness: "astronomical" as const },
    };
    const fixed = planNight({ ...base, target: { kind: "fixed", raDeg: 10.68, decDeg: 41.27 } }, "2025-10-10");
    const moving = planNight({ ...base, target: { kind: "ephemeris", ephemeris: new Ephemeris(rows) } }, "2025-10-10");
    expect(moving.windows).toHaveLength(fixed.windows.length);
    moving.windows.forEach((w, i) => {
      expect(Math.abs(w.start - fixed.windows[i]!.start)).toBeLessThan(5000);
      expect(Math.abs(w.end - fixed.windows[i]!.end)).toBeLessThan(5000);
      expect(w.bestAltitudeDeg).toBeCloseTo(fixed.windows[i]!.bestAltitudeDeg, 2);
    });
  });

  it("a near-Earth object gets topocentric parallax: altitude matches astronomy-engine's parts within 2″", () => {
    // Invented object on a straight geocentric path ~0.002 au away (parallax up to ~1.2°).
    // Expected side: astronomy-engine's observer vector (parallax), Earth velocity
    // (aberration), precession–nutation matrix and Horizon().
    const t0 = Date.UTC(2026, 2, 10);
    const p0 = [0.0012, 0.0014, -0.0006];
    const v = [-0.0002, 0.00005, 0.0001]; // au per day
    const pos = (t: number) => p0.map((x, k) => x + v[k]! * ((t - t0) / 86_400_000)) as [number, number, number];
    const rows = Array.from({ length: 49 }, (_, i) => {
      const t = t0 + i * 3_600_000;
      const [x, y, z] = pos(t);
      const d = Math.hypot(x, y, z);
      return {
        time: t,
        raDeg: ((Math.atan2(y, x) * 180) / Math.PI + 360) % 360,
        decDeg: (Math.asin(z / d) * 180) / Math.PI,
        deltaAu: d,
        rAu: 1,
      };
    });
    const ephemeris = new Ephemeris(rows);
    const req: PlanRequest = {
      site,
      target: { kind: "ephemeris", ephemeris },
      telescope: { minAltitudeDeg: 0, sunAvoidanceDeg: 0 },
      constraints: { darkness: "civil" },
    };
    const planner = new Planner(req);
    const span = nightSpan(site, "2026-03-10");
    const points = planner.curve(span, 30, Math.max(span.start, t0), Math.min(span.end, t0 + 47 * 3_600_000));
    const observer = new AE.Observer(site.latitudeDeg, site.longitudeDeg, site.heightM);
    let worst = 0;
    let largestParallax = 0;
    for (const point of points) {
      const time = AE.MakeTime(new Date(point.time));
      const o = AE.ObserverVector(time, observer, false);
      const [x, y, z] = pos(point.time);
      const q = [x - o.x, y - o.y, z - o.z];
      const n = Math.hypot(q[0]!, q[1]!, q[2]!);
      const earth = AE.BaryState(AE.Body.Earth, time);
      const c = AE.C_AUDAY;
      const w = new AE.Vector(q[0]! / n + earth.vx / c, q[1]! / n + earth.vy / c, q[2]! / n + earth.vz / c, time);
      const eq = AE.EquatorFromVector(AE.RotateVector(AE.Rotation_EQJ_EQD(time), w));
      const hor = AE.Horizon(time, observer, eq.ra, eq.dec);
      worst = Math.max(worst, Math.abs(point.altitudeDeg! - hor.altitude) * 3600);
      const geo = AE.EquatorFromVector(AE.RotateVector(AE.Rotation_EQJ_EQD(time), new AE.Vector(x, y, z, time)));
      largestParallax = Math.max(
        largestParallax,
        Math.abs(AE.Horizon(time, observer, geo.ra, geo.dec).altitude - hor.altitude),
      );
    }
    expect(points.length).toBeGreaterThan(10);
    expect(largestParallax).toBeGreaterThan(0.5); // the test would notice a missing parallax
    expect(worst).toBeLessThan(2);
  });
});

describe("fast movers against a minute-by-minute brute force", () => {
  // Invented near-Earth objects on straight geocentric paths (Δ 0.003–0.05 au, several
  // degrees a day). The planner walks the 1-minute grid in strides bounded by how fast each
  // margin can change; the brute force evaluates every minute of the same function.
  const random = seededRandom(99);
  const cases = Array.from({ length: 16 }, () => {
    const site: Site = { latitudeDeg: -50 + 100 * random(), longitudeDeg: -180 + 360 * random(), heightM: 1000 };
    const night = new Date(Date.UTC(2027, 0, 1) + Math.floor(random() * 365) * 86_400_000).toISOString().slice(0, 10);
    const span = nightSpan(site, night);
    const t0 = span.start - 86_400_000;
    const dir = [random() - 0.5, random() - 0.5, random() - 0.5];
    const vel = [random() - 0.5, random() - 0.5, random() - 0.5].map((x) => x * 0.02); // au/day
    const distance = 0.003 + 0.05 * random();
    const n = Math.hypot(dir[0]!, dir[1]!, dir[2]!);
    const rows = Array.from({ length: 73 }, (_, i) => {
      const t = t0 + i * 3_600_000;
      const d = i / 24;
      const [x, y, z] = dir.map((c, k) => (c / n) * distance + vel[k]! * d * distance * 10) as [number, number, number];
      const r = Math.hypot(x, y, z);
      return {
        time: t,
        raDeg: ((Math.atan2(y, x) * 180) / Math.PI + 360) % 360,
        decDeg: (Math.asin(z / r) * 180) / Math.PI,
        deltaAu: r,
      };
    });
    return { site, night, ephemeris: new Ephemeris(rows) };
  });

  it.each(cases.map((c, i) => [i, c] as const))("case %i", (_, { site, night, ephemeris }) => {
    const req: PlanRequest = {
      site,
      target: { kind: "ephemeris", ephemeris },
      telescope: { minAltitudeDeg: 25, sunAvoidanceDeg: 0 },
      constraints: { darkness: "nautical" },
    };
    const planner = new Planner(req);
    const span = nightSpan(site, night);
    const curve = planner.curve(span, 1);
    const expected: Interval[] = [];
    let open: number | null = null;
    for (const p of curve) {
      const ok = p.sunAltitudeDeg <= -12 && p.altitudeDeg !== null && p.altitudeDeg >= 25;
      if (ok && open === null) open = p.time;
      if (!ok && open !== null) {
        expected.push({ start: open, end: p.time });
        open = null;
      }
    }
    if (open !== null) expected.push({ start: open, end: span.end });
    expectSameWindows(planner.night(span).windows, expected, MINUTE);
  });
});

describe("Moon, Sun and request constraints", () => {
  const site: Site = { latitudeDeg: -30.17, longitudeDeg: -70.8, heightM: 2200, timeZone: "America/Santiago" };

  it("keeps the Moon away: inside every window the Moon is set or far enough", () => {
    // 2025-01-13 is full Moon; a target 25° from it.
    const night = "2025-01-13";
    const span = nightSpan(site, night);
    const moon = moonPositionFrom(site, (span.start + span.end) / 2);
    const req: PlanRequest = {
      site,
      target: { kind: "fixed", raDeg: moon.raDeg + 25, decDeg: moon.decDeg },
      telescope: { minAltitudeDeg: 20, sunAvoidanceDeg: 30 },
      constraints: { darkness: "nautical", minMoonSeparationDeg: 30 },
    };
    const free = planNight({ ...req, constraints: { darkness: "nautical" } }, night);
    const plan = planNight(req, night);
    expect(plan.observableMinutes).toBeLessThan(free.observableMinutes);
    for (const w of plan.windows) {
      for (let t = w.start + 1000; t < w.end; t += 5 * MINUTE) {
        const m = moonPositionFrom(site, t);
        const p = fixedTargetPosition(moon.raDeg + 25, moon.decDeg, site, t);
        const ok = m.altitudeDeg < 0 || angularSeparationDeg(p.raDeg, p.decDeg, m.raDeg, m.decDeg) >= 30 - 0.01;
        expect(ok).toBe(true);
      }
    }
    // A bright-Moon cap removes every moment the (94 % lit) Moon is up.
    const dim = planNight({ ...req, constraints: { darkness: "nautical", maxMoonIllumination: 0.5 } }, night);
    for (const w of dim.windows) expect(moonPositionFrom(site, (w.start + w.end) / 2).altitudeDeg).toBeLessThan(0);
  });

  it("sun avoidance: refused near the Sun, clear far from it, restricted when the limit bites mid-window", () => {
    const night = "2025-03-20";
    const span = nightSpan(site, night);
    const sun = sunPositionFrom(site, span.start + 8 * 3_600_000);
    const near = planNight(
      {
        site,
        target: { kind: "fixed", raDeg: sun.raDeg + 30, decDeg: sun.decDeg },
        telescope: { minAltitudeDeg: 5, sunAvoidanceDeg: 45 },
        constraints: { darkness: "civil" },
      },
      night,
    );
    expect(near.sunAvoidance.status).toBe("refused");
    expect(near.windows).toEqual([]);
    expect(near.sunAvoidance.reason).toMatch(/Refused/);
    const far = planNight(
      {
        site,
        target: { kind: "fixed", raDeg: sun.raDeg + 180, decDeg: -sun.decDeg },
        telescope: { minAltitudeDeg: 20, sunAvoidanceDeg: 45 },
        constraints: { darkness: "civil" },
      },
      night,
    );
    expect(far.sunAvoidance.status).toBe("clear");
    // A limit between the separations at the start and the end of the candidate time.
    const probe = {
      site,
      target: { kind: "fixed" as const, raDeg: sun.raDeg + 40, decDeg: sun.decDeg - 10 },
      telescope: { minAltitudeDeg: 5, sunAvoidanceDeg: 0 },
      constraints: { darkness: "civil" as const },
    };
    const open = planNight(probe, night);
    expect(open.windows.length).toBeGreaterThan(0);
    const w = open.windows[0]!;
    const sep = (t: number) => {
      const p = fixedTargetPosition(probe.target.raDeg, probe.target.decDeg, site, t);
      const s = sunPositionFrom(site, t);
      return angularSeparationDeg(p.raDeg, p.decDeg, s.raDeg, s.decDeg);
    };
    const limit = (sep(w.start) + sep(w.end)) / 2;
    const cut = planNight({ ...probe, telescope: { minAltitudeDeg: 5, sunAvoidanceDeg: limit } }, night);
    expect(cut.sunAvoidance.status).toBe("restricted");
    expect(cut.observableMinutes).toBeLessThan(open.observableMinutes);
    expect(cut.observableMinutes).toBeGreaterThan(0);
  });

  it("a zenith blind spot splits the window around the culmination", () => {
    const req: PlanRequest = {
      site,
      target: { kind: "fixed", raDeg: 150, decDeg: -30 }, // passes 0.2° from the zenith
      telescope: { minAltitudeDeg: 20, maxAltitudeDeg: 85, sunAvoidanceDeg: 30 },
      constraints: { darkness: "astronomical" },
    };
    const plan = planNight(req, "2025-03-25");
    expect(plan.windows).toHaveLength(2);
    for (const w of plan.windows) expect(w.bestAltitudeDeg).toBeLessThanOrEqual(85 + 1e-6);
    const gap = plan.windows[1]!.start - plan.windows[0]!.end;
    expect(gap / MINUTE).toBeGreaterThan(30); // 5° around the zenith at this latitude
    expect(
      planNight({ ...req, telescope: { ...req.telescope, declinationDeg: { min: -20, max: 60 } } }, "2025-03-25")
        .windows,
    ).toEqual([]);
  });

  it("drops windows shorter than the requested minimum", () => {
    const req: PlanRequest = {
      site,
      target: { kind: "fixed", raDeg: 83.82, decDeg: -5.39 },
      telescope: { minAltitudeDeg: 20, sunAvoidanceDeg: 30 },
      constraints: { darkness: "astronomical" },
    };
    const plan = planNight(req, "2025-04-20");
    expect(plan.windows).toHaveLength(1);
    const short = plan.windows[0]!.durationMinutes;
    expect(
      planNight({ ...req, constraints: { darkness: "astronomical", minWindowMinutes: short + 1 } }, "2025-04-20")
        .windows,
    ).toEqual([]);
  });

  it("refraction (optional) lifts the target: a setting target's window gets a little longer", () => {
    const req: PlanRequest = {
      site,
      target: { kind: "fixed", raDeg: 83.82, decDeg: -5.39 },
      telescope: { minAltitudeDeg: 20, sunAvoidanceDeg: 30 },
      constraints: { darkness: "astronomical" },
    };
    const plain = planNight(req, "2025-04-20").windows[0]!;
    const refracted = planNight({ ...req, options: { refraction: true } }, "2025-04-20").windows[0]!;
    // 20° observed ≈ 19.96° geometric: about 10 s more at this rate of setting.
    expect(refracted.end - plain.end).toBeGreaterThan(5000);
    expect(refracted.end - plain.end).toBeLessThan(60_000);
  });
});
