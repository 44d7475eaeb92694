// Where suncalc 2.0.2 is accurate enough, measured against astronomy-engine 2.1.19:
// - Moon rise/set: within seconds → the engine uses it for the Moon's rise and set.
// - Twilight: mostly within a minute, but its low-accuracy Sun (~36″) turns into many
//   minutes when the Sun skims a threshold (high latitudes), and its height argument
//   lowers the twilight thresholds by the horizon dip → the engine computes the Sun itself.

import * as AE from "astronomy-engine";
import { getMoonTimes, getTimes } from "suncalc";
import { describe, expect, it } from "vitest";
import { moonRiseSet } from "@/lib/sky/moon-sky";
import { nightEvents, nightSpan, SkyTracks } from "@/lib/sky";
import { seededRandom } from "./helpers";

describe("suncalc Moon rise/set (used for display)", () => {
  it("agrees with astronomy-engine within 60 s on 400 random site-days (|lat| ≤ 60°)", () => {
    const random = seededRandom(31);
    let compared = 0;
    let worst = 0;
    for (let i = 0; i < 400; i++) {
      const lat = -60 + 120 * random();
      const lon = -180 + 360 * random();
      const day = Date.UTC(2000, 0, 1) + Math.floor(random() * 365 * 30) * 86_400_000;
      const times = getMoonTimes(new Date(day), lat, lon);
      const observer = new AE.Observer(lat, lon, 0);
      for (const [key, direction] of [
        ["rise", 1],
        ["set", -1],
      ] as const) {
        const ae = AE.SearchRiseSet(AE.Body.Moon, observer, direction, new Date(day), 1);
        const ours = times[key]?.getTime() ?? null;
        expect(ours === null).toBe(ae === null);
        if (ae && ours !== null) {
          compared++;
          worst = Math.max(worst, Math.abs(ae.date.getTime() - ours) / 1000);
        }
      }
    }
    expect(compared).toBeGreaterThan(700);
    expect(worst).toBeLessThan(60);
  });

  it("moonRiseSet picks the events inside a night", () => {
    const site = { latitudeDeg: -30.17, longitudeDeg: -70.8, heightM: 2200, timeZone: "America/Santiago" };
    const span = nightSpan(site, "2025-01-15");
    const { rise, set } = moonRiseSet(site, span.start, span.end);
    const observer = new AE.Observer(site.latitudeDeg, site.longitudeDeg, 0);
    const aeRise = AE.SearchRiseSet(AE.Body.Moon, observer, 1, new Date(span.start), 1)!;
    expect(Math.abs(rise! - aeRise.date.getTime())).toBeLessThan(60_000);
    expect(set! > span.start && set! < span.end).toBe(true);
  });
});

describe("suncalc twilight (not used)", () => {
  it("is within 60 s of astronomy-engine at mid-latitudes", () => {
    const random = seededRandom(5);
    let worst = 0;
    for (let i = 0; i < 200; i++) {
      const lat = -45 + 90 * random();
      const lon = -180 + 360 * random();
      const day = Date.UTC(2000, 0, 1) + Math.floor(random() * 365 * 30) * 86_400_000;
      const times = getTimes(new Date(day + 12 * 3_600_000 - (lon / 15) * 3_600_000), lat, lon);
      const observer = new AE.Observer(lat, lon, 0);
      const dusk = AE.SearchAltitude(AE.Body.Sun, observer, -1, new Date(times.solarNoon), 1, -12)!;
      worst = Math.max(worst, Math.abs(dusk.date.getTime() - times.nauticalDusk!.getTime()) / 1000);
    }
    expect(worst).toBeLessThan(60);
  });

  it("is ~20 minutes off where the Sun skims −18° (lat −62.01°, 2029-02-22); ours is within 60 s", () => {
    // Found by the random cross-check: the Sun bottoms out 0.19° below −18°, far enough
    // from grazing that a 1″ Sun gets it right and a 36″ Sun does not.
    const lat = -62.01257;
    const lon = 0.49249;
    const site = { latitudeDeg: lat, longitudeDeg: lon, heightM: 0 };
    const ev = nightEvents(site, "2029-02-22", new SkyTracks());
    expect(ev.sunAltitudeAtMidnightDeg).toBeLessThan(-18.1);
    const observer = new AE.Observer(lat, lon, 0);
    const ae = AE.SearchAltitude(AE.Body.Sun, observer, -1, new Date(ev.start), 1, -18)!.date.getTime();
    const sc = getTimes(new Date(ev.start + 6 * 3_600_000), lat, lon).night!.getTime();
    expect(Math.abs(ev.astronomicalDusk! - ae)).toBeLessThan(60_000);
    expect(Math.abs(sc - ae)).toBeGreaterThan(10 * 60_000);
  });

  it("its height argument lowers twilight thresholds by the horizon dip — wrong for twilight", () => {
    // suncalc's dip −2.076′·√h at 2500 m is −1.73°: every threshold, −12° included, moves.
    const lat = -24.63;
    const lon = -70.4;
    const day = new Date(Date.UTC(2025, 6, 1, 16));
    const sea = getTimes(day, lat, lon).nauticalDusk!.getTime();
    const high = getTimes(day, lat, lon, 2500).nauticalDusk!.getTime();
    expect((high - sea) / 60_000).toBeGreaterThan(5);
    // Twilight is defined by the Sun's geometric altitude: height changes it by seconds.
    const at = (h: number) =>
      AE.SearchAltitude(
        AE.Body.Sun,
        new AE.Observer(lat, lon, h),
        -1,
        new Date(Date.UTC(2025, 6, 1, 16)),
        1,
        -12,
      )!.date.getTime();
    expect(Math.abs(at(2500) - at(0))).toBeLessThan(2000);
  });
});
