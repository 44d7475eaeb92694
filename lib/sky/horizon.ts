// Equator of date → horizon. Altitude is geometric unless refraction is asked for;
// azimuth is measured from north through east (N = 0°, E = 90°). Hour angle is positive
// west of the meridian: H = local apparent sidereal time − apparent right ascension.

import { DEG, normalizeDegrees, normalizeRadians, wrap180 } from "./angles";
import { type Atmosphere, refractionDeg } from "./refraction";
import { localSiderealTime } from "./sidereal-time";
import type { Site } from "./site";
import type { Instant } from "./time-scales";

/** Altitude and azimuth (radians) from hour angle, declination and latitude (radians). */
export function horizontalFromHourAngle(ha: number, dec: number, lat: number): { alt: number; az: number } {
  const sinDec = Math.sin(dec);
  const cosDec = Math.cos(dec);
  const sinLat = Math.sin(lat);
  const cosLat = Math.cos(lat);
  const cosHa = Math.cos(ha);
  const alt = Math.asin(Math.max(-1, Math.min(1, sinLat * sinDec + cosLat * cosDec * cosHa)));
  const az = normalizeRadians(Math.atan2(-cosDec * Math.sin(ha), sinDec * cosLat - cosDec * sinLat * cosHa));
  return { alt, az };
}

export interface HorizontalOptions {
  /** Add atmospheric refraction to the altitude. Off by default: altitudes are geometric. */
  refraction?: Atmosphere | boolean;
}

export interface HorizontalPosition {
  altitudeDeg: number;
  azimuthDeg: number;
  /** Hour angle in degrees, (−180, 180], positive west. */
  hourAngleDeg: number;
}

/** Horizontal position of an apparent place of date (degrees) for a site and instant. */
export function horizontalPosition(
  raOfDateDeg: number,
  decOfDateDeg: number,
  site: Site,
  t: Instant,
  options: HorizontalOptions = {},
): HorizontalPosition {
  const haDeg = wrap180(localSiderealTime(t, site.longitudeDeg) - raOfDateDeg);
  const { alt, az } = horizontalFromHourAngle(haDeg * DEG, decOfDateDeg * DEG, site.latitudeDeg * DEG);
  let altitudeDeg = alt / DEG;
  if (options.refraction) {
    altitudeDeg += refractionDeg(altitudeDeg, options.refraction === true ? undefined : options.refraction);
  }
  return { altitudeDeg, azimuthDeg: normalizeDegrees(az / DEG), hourAngleDeg: haDeg };
}
