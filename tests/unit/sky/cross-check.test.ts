// Cross-check against astronomy-engine 2.1.19 on 1,200 random site/target/time cases,
// latitudes −70°…+70°, years 1990–2050 (the span of the shared ΔT polynomial's best fit).
//
// Same effects on both sides: astronomy-engine's Horizon() takes whatever RA/Dec it is
// given, so its side uses Equator(star, ofdate=true, aberration=true), which adds annual
// aberration; neither side refracts. Tolerances:
//   altitude and on-sky azimuth (Δaz·cos alt) ........ 2″
//   twilight and sunrise/sunset events ............... 60 s
//   topocentric Moon–target separation ............... 15″
//   topocentric illuminated fraction of the Moon ..... 0.001
// Twilight times are compared only where the Sun's lowest (or highest) altitude that night
// is more than 0.05° from the threshold: at a grazing crossing 1″ of position is minutes
// of time, for any two implementations.

import * as AE from "astronomy-engine";
import { beforeAll, describe, expect, it } from "vitest";
import {
  angularSeparationDeg,
  dateFromDayNumber,
  dayNumber,
  fixedTargetPosition,
  moonPositionFrom,
  type NightEvents,
  nightEvents,
  SkyTracks,
  sunPositionFrom,
} from "@/lib/sky";
import { seededRandom } from "./helpers";

const CASES = 1200;
const random = seededRandom(20240611);

interface Case {
  lat: number;
  lon: number;
  height: number;
  ra: number;
  dec: number;
  t: number;
  nightOf: string;
}

const cases: Case[] = Array.from({ length: CASES }, () => {
  const t = Date.UTC(1990, 0, 1) + random() * 60 * 365.25 * 86_400_000;
  return {
    lat: -70 + 140 * random(),
    lon: -180 + 360 * random(),
    height: 3000 * random(),
    ra: 360 * random(),
    dec: (Math.asin(2 * random() - 1) * 180) / Math.PI,
    t,
    nightOf: dateFromDayNumber(Math.floor(t / 86_400_000)),
  };
});

function topocentricIllumination(c: Case): number {
  const time = AE.MakeTime(new Date(c.t));
  const o = AE.ObserverVector(time, new AE.Observer(c.lat, c.lon, c.height), false);
  const m = AE.GeoMoon(time);
  const s = AE.GeoVector(AE.Body.Sun, time, true);
  const mx = m.x - o.x,
    my = m.y - o.y,
    mz = m.z - o.z;
  const dx = s.x - o.x - mx,
    dy = s.y - o.y - my,
    dz = s.z - o.z - mz;
  const cosI = -(dx * mx + dy * my + dz * mz) / (Math.hypot(dx, dy, dz) * Math.hypot(mx, my, mz));
  return (1 + cosI) / 2;
}

describe(`cross-check with astronomy-engine on ${CASES} random cases`, () => {
  it("fixed-target altitude and on-sky azimuth agree within 2″", () => {
    let worstAlt = 0;
    let worstAz = 0;
    for (const c of cases) {
      const site = { latitudeDeg: c.lat, longitudeDeg: c.lon, heightM: c.height };
      const mine = fixedTargetPosition(c.ra, c.dec, site, c.t);
      const observer = new AE.Observer(c.lat, c.lon, c.height);
      AE.DefineStar(AE.Body.Star1, c.ra / 15, c.dec, 1e6);
      const eq = AE.Equator(AE.Body.Star1, new Date(c.t), observer, true, true);
      const hor = AE.Horizon(new Date(c.t), observer, eq.ra, eq.dec);
      worstAlt = Math.max(worstAlt, Math.abs(mine.altitudeDeg - hor.altitude) * 3600);
      let dAz = Math.abs(mine.azimuthDeg - hor.azimuth);
      dAz = Math.min(dAz, 360 - dAz);
      worstAz = Math.max(worstAz, dAz * 3600 * Math.cos((hor.altitude * Math.PI) / 180));
    }
    expect(worstAlt).toBeLessThan(2);
    expect(worstAz).toBeLessThan(2);
  });

  it("topocentric Moon–target separation within 15″ and illuminated fraction within 0.001", () => {
    let worstSep = 0;
    let worstIllum = 0;
    for (const c of cases) {
      const site = { latitudeDeg: c.lat, longitudeDeg: c.lon, heightM: c.height };
      const target = fixedTargetPosition(c.ra, c.dec, site, c.t);
      const moon = moonPositionFrom(site, c.t);
      const mine = angularSeparationDeg(target.raDeg, target.decDeg, moon.raDeg, moon.decDeg);
      const observer = new AE.Observer(c.lat, c.lon, c.height);
      AE.DefineStar(AE.Body.Star1, c.ra / 15, c.dec, 1e6);
      const s = AE.Equator(AE.Body.Star1, new Date(c.t), observer, true, true);
      const m = AE.Equator(AE.Body.Moon, new Date(c.t), observer, true, true);
      const theirs = angularSeparationDeg(s.ra * 15, s.dec, m.ra * 15, m.dec);
      worstSep = Math.max(worstSep, Math.abs(mine - theirs) * 3600);
      worstIllum = Math.max(worstIllum, Math.abs(moon.illumination - topocentricIllumination(c)));
    }
    expect(worstSep).toBeLessThan(15);
    expect(worstIllum).toBeLessThan(0.001);
  });

  describe("night events", () => {
    const tracks = new SkyTracks();
    const thresholds = [
      ["civilDusk", -1, -6],
      ["nauticalDusk", -1, -12],
      ["astronomicalDusk", -1, -18],
      ["astronomicalDawn", 1, -18],
      ["nauticalDawn", 1, -12],
      ["civilDawn", 1, -6],
    ] as const;
    let compared = 0;
    let grazing = 0;
    let worst = 0;
    const problems: string[] = [];

    beforeAll(() => {
      for (const c of cases) {
        const site = { latitudeDeg: c.lat, longitudeDeg: c.lon, heightM: 0 };
        const ev: NightEvents = nightEvents(site, c.nightOf, tracks);
        const observer = new AE.Observer(c.lat, c.lon, 0);
        const noonAlt = Math.max(
          sunPositionFrom(site, ev.start).altitudeDeg,
          sunPositionFrom(site, ev.end).altitudeDeg,
        );
        const check = (name: string, mine: number | null, found: AE.AstroTime | null, margin: number) => {
          const theirs = found && found.date.getTime() < ev.end ? found.date.getTime() : null;
          if (margin < 0.05) {
            grazing++;
            return;
          }
          if ((mine === null) !== (theirs === null)) {
            problems.push(`${name} ${c.nightOf} lat ${c.lat.toFixed(2)}: ours ${mine}, theirs ${theirs}`);
            return;
          }
          if (mine !== null && theirs !== null) {
            compared++;
            worst = Math.max(worst, Math.abs(mine - theirs) / 1000);
          }
        };
        for (const [name, direction, altitude] of thresholds) {
          const found = AE.SearchAltitude(AE.Body.Sun, observer, direction, new Date(ev.start), 1, altitude);
          const margin = Math.min(Math.abs(ev.sunAltitudeAtMidnightDeg - altitude), Math.abs(noonAlt - altitude));
          check(name, ev[name], found, margin);
        }
        const riseMargin = Math.min(Math.abs(ev.sunAltitudeAtMidnightDeg + 0.833), Math.abs(noonAlt + 0.833));
        check("sunset", ev.sunset, AE.SearchRiseSet(AE.Body.Sun, observer, -1, new Date(ev.start), 1), riseMargin);
        check("sunrise", ev.sunrise, AE.SearchRiseSet(AE.Body.Sun, observer, 1, new Date(ev.start), 1), riseMargin);
      }
    });

    it("agree within 60 s (non-grazing), and occur or not together", () => {
      expect(problems).toEqual([]);
      expect(worst).toBeLessThan(60);
      expect(compared).toBeGreaterThan(CASES * 5);
      expect(grazing).toBeLessThan(CASES * 0.01 * 8);
    });
  });

  it("dates used are real local dates", () => {
    expect(cases.every((c) => dayNumber(c.nightOf) !== null)).toBe(true);
  });
});
