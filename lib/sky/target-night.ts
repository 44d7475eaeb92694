// What the window finder needs from a target for one night, whatever kind it is.

import { airmassKastenYoung } from "./airmass";
import type { Interval } from "./intervals";
import type { Instant } from "./time-scales";
import type { Vec3 } from "./vectors";

export interface ObservableWindow {
  start: Instant;
  end: Instant;
  durationMinutes: number;
  /** Highest geometric altitude in the window, its Kasten & Young airmass, and when. */
  bestAltitudeDeg: number;
  bestAirmass: number | null;
  bestAt: Instant;
}

export interface TargetNight {
  /** Where every constraint but the Sun's and the Moon's holds. */
  candidate: Interval[];
  /** The candidate time that also keeps the sun-avoidance limit. */
  afterSun: Interval[];
  /** Topocentric apparent direction (true equator of date), or null where unknown. */
  direction: (t: Instant) => Vec3 | null;
  /** A window with its best altitude filled in. */
  best: (w: Interval) => ObservableWindow;
}

export const ONE_SECOND = 1000;

export function makeWindow(w: Interval, bestAltitudeDeg: number, bestAt: Instant): ObservableWindow {
  return {
    start: w.start,
    end: w.end,
    durationMinutes: (w.end - w.start) / 60_000,
    bestAltitudeDeg,
    bestAirmass: airmassKastenYoung(bestAltitudeDeg),
    bestAt,
  };
}
