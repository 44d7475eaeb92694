// Sidereal time: Greenwich mean sidereal time by Meeus 12.4 (IAU 1982, argument UT), the
// equation of the equinoxes Δψ cos ε for apparent time, and local time with east-positive
// longitude. The Earth's rotation is this one angle; everything else in a night is slow.

import { DEG, normalizeDegrees } from "./angles";
import { meanObliquity, nutation } from "./nutation";
import { centuriesTT, daysSinceJ2000, type Instant } from "./time-scales";

/** Rate of Greenwich sidereal time, radians per millisecond of UT. */
export const SIDEREAL_RATE = (360.98564736629 * DEG) / 86_400_000;

/** Greenwich mean sidereal time, degrees in [0, 360). */
export function greenwichMeanSiderealTime(t: Instant): number {
  const d = daysSinceJ2000(t);
  const T = d / 36525;
  return normalizeDegrees(280.46061837 + 360.98564736629 * d + T * T * (0.000387933 - T / 38710000));
}

/** Equation of the equinoxes Δψ cos ε in degrees for T centuries of TT. */
export function equationOfEquinoxes(T: number): number {
  const { deltaPsi, deltaEpsilon } = nutation(T);
  const eps = meanObliquity(T) + (deltaEpsilon / 3600) * DEG;
  return (deltaPsi * Math.cos(eps)) / 3600;
}

/** Greenwich apparent sidereal time, degrees in [0, 360). */
export function greenwichApparentSiderealTime(t: Instant): number {
  return normalizeDegrees(greenwichMeanSiderealTime(t) + equationOfEquinoxes(centuriesTT(t)));
}

/** Local apparent sidereal time for an east-positive longitude, degrees in [0, 360). */
export function localSiderealTime(t: Instant, longitudeDeg: number): number {
  return normalizeDegrees(greenwichApparentSiderealTime(t) + longitudeDeg);
}
