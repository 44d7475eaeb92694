// An observing site and the geometry derived from it. Latitude is geodetic (WGS 84),
// longitude east-positive, height above the ellipsoid in metres (the difference from
// height above sea level moves nothing measurable here).

import { DEG } from "./angles";
import type { Vec3 } from "./vectors";

export interface Site {
  latitudeDeg: number;
  /** East-positive longitude, degrees (west of Greenwich is negative). */
  longitudeDeg: number;
  heightM: number;
  /** IANA time zone, e.g. "America/Santiago"; only used to name nights and show local time. */
  timeZone?: string;
}

export const EARTH_EQUATORIAL_RADIUS_KM = 6378.137;
const FLATTENING = 1 / 298.257223563;
const E2 = FLATTENING * (2 - FLATTENING);
export const KM_PER_AU = 149_597_870.7;

export interface SiteGeometry {
  lat: number;
  lon: number;
  sinLat: number;
  cosLat: number;
  /** Distance from the Earth's axis and above the equatorial plane, km (ρ cos φ′, ρ sin φ′). */
  axisDistanceKm: number;
  equatorDistanceKm: number;
}

export function siteGeometry(site: Site): SiteGeometry {
  const lat = site.latitudeDeg * DEG;
  const sinLat = Math.sin(lat);
  const cosLat = Math.cos(lat);
  const n = EARTH_EQUATORIAL_RADIUS_KM / Math.sqrt(1 - E2 * sinLat * sinLat);
  const h = site.heightM / 1000;
  return {
    lat,
    lon: site.longitudeDeg * DEG,
    sinLat,
    cosLat,
    axisDistanceKm: (n + h) * cosLat,
    equatorDistanceKm: (n * (1 - E2) + h) * sinLat,
  };
}

/** Geocentric position of the observer, km, in the true equator of date, for local
 * apparent sidereal time `last` (radians). */
export function observerVectorKm(g: SiteGeometry, last: number): Vec3 {
  return [g.axisDistanceKm * Math.cos(last), g.axisDistanceKm * Math.sin(last), g.equatorDistanceKm];
}

/** Local vertical (geodetic zenith) as a unit vector in the true equator of date. */
export function zenithVector(g: SiteGeometry, last: number): Vec3 {
  return [g.cosLat * Math.cos(last), g.cosLat * Math.sin(last), g.sinLat];
}
