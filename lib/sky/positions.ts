// One-off positions for one instant (no tracks, no nights): handy for pages and tests.

import { DEG, normalizeDegrees } from "./angles";
import { airmassKastenYoung } from "./airmass";
import { type ProperMotion, apparentDirection, catalogueDirection, dateFrame } from "./apparent-place";
import { horizontalFromHourAngle, type HorizontalOptions } from "./horizon";
import { illuminatedFraction, moonApparent, moonVectorKm, phaseAngle } from "./moon";
import { refractionDeg } from "./refraction";
import { greenwichMeanSiderealTime } from "./sidereal-time";
import { KM_PER_AU, observerVectorKm, type Site, siteGeometry } from "./site";
import { sunApparent } from "./sun";
import { centuriesTT, type Instant } from "./time-scales";
import { angleBetween, scale, sub, toSpherical, unitVector, type Vec3 } from "./vectors";

export interface SkyPosition {
  /** Apparent right ascension and declination of date (topocentric for the Moon), degrees. */
  raDeg: number;
  decDeg: number;
  altitudeDeg: number;
  /** From north through east. */
  azimuthDeg: number;
  hourAngleDeg: number;
  /** Kasten & Young; null below the horizon. */
  airmass: number | null;
}

function local(site: Site, t: Instant) {
  const T = centuriesTT(t);
  const frame = dateFrame(T);
  const geo = siteGeometry(site);
  const last = greenwichMeanSiderealTime(t) * DEG + frame.equationOfEquinoxes + geo.lon;
  return { T, frame, geo, last };
}

function toPosition(dir: Vec3, last: number, latRad: number, options: HorizontalOptions): SkyPosition {
  const { lon: ra, lat: dec } = toSpherical(dir);
  let ha = (last - ra) % (2 * Math.PI);
  if (ha > Math.PI) ha -= 2 * Math.PI;
  if (ha <= -Math.PI) ha += 2 * Math.PI;
  const { alt, az } = horizontalFromHourAngle(ha, dec, latRad);
  const geometric = alt / DEG;
  const altitudeDeg = options.refraction
    ? geometric + refractionDeg(geometric, options.refraction === true ? undefined : options.refraction)
    : geometric;
  return {
    raDeg: ra / DEG,
    decDeg: dec / DEG,
    altitudeDeg,
    azimuthDeg: normalizeDegrees(az / DEG),
    hourAngleDeg: ha / DEG,
    airmass: airmassKastenYoung(geometric),
  };
}

/** Apparent horizontal position of a fixed ICRS/J2000 target. */
export function fixedTargetPosition(
  raDeg: number,
  decDeg: number,
  site: Site,
  t: Instant,
  options: HorizontalOptions & ProperMotion = {},
): SkyPosition {
  const { T, frame, geo, last } = local(site, t);
  const dir = apparentDirection(frame, catalogueDirection(raDeg * DEG, decDeg * DEG, T, options));
  return toPosition(dir, last, geo.lat, options);
}

/** The Sun's apparent position from a site (geocentric place; its 8.8″ parallax ignored). */
export function sunPositionFrom(site: Site, t: Instant, options: HorizontalOptions = {}): SkyPosition {
  const { T, frame, geo, last } = local(site, t);
  const s = sunApparent(T, frame.nutation);
  return toPosition(unitVector(s.ra, s.dec), last, geo.lat, options);
}

export interface MoonFromSite extends SkyPosition {
  distanceKm: number;
  /** Topocentric illuminated fraction, 0…1. */
  illumination: number;
}

/** The Moon's topocentric apparent position and illuminated fraction from a site. */
export function moonPositionFrom(site: Site, t: Instant, options: HorizontalOptions = {}): MoonFromSite {
  const { T, frame, geo, last } = local(site, t);
  const m = sub(moonVectorKm(moonApparent(T, frame.nutation)), observerVectorKm(geo, last));
  const s = sunApparent(T, frame.nutation);
  const sun = scale(unitVector(s.ra, s.dec), s.distanceAu * KM_PER_AU);
  const distanceKm = Math.hypot(m[0], m[1], m[2]);
  return {
    ...toPosition(scale(m, 1 / distanceKm), last, geo.lat, options),
    distanceKm,
    illumination: illuminatedFraction(phaseAngle(sun, m)),
  };
}

/** Great-circle separation of two positions, degrees. */
export function angularSeparationDeg(ra1Deg: number, dec1Deg: number, ra2Deg: number, dec2Deg: number): number {
  return angleBetween(unitVector(ra1Deg * DEG, dec1Deg * DEG), unitVector(ra2Deg * DEG, dec2Deg * DEG)) / DEG;
}
