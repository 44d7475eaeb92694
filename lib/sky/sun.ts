// The Sun's apparent place by Meeus ch. 25 "higher accuracy": VSOP87 Earth (Appendix III),
// FK5 correction, nutation (ch. 22) and annual aberration −20.4898″/R. Good to ~1″.
//
// Why not suncalc 2.0.2 for the Sun and twilight: its Sun is the ch. 25 low-accuracy
// series (~0.01° ≈ 36″). That is within a minute of twilight time at mid-latitudes, but
// where the Sun skims a threshold (high latitudes, near the end of the "no astronomical
// night" season) 36″ becomes tens of minutes — 21 min in a case the tests pin — and its
// height argument lowers the twilight thresholds by the horizon dip, which is wrong for
// twilight (suncalc-accuracy.test.ts measures both). Its Moon rise/set is accurate to
// seconds and is used for display (moon-sky.ts).

import { ARCSEC, DEG, normalizeRadians } from "./angles";
import { meanObliquity, type Nutation, nutation } from "./nutation";
import { centuriesTT, type Instant } from "./time-scales";
import { B0, B1, L0, L1, L2, L3, L4, L5, R0, R1, R2, R3, R4 } from "./vsop87-earth";

function series(terms: readonly number[], tau: number): number {
  let s = 0;
  for (let i = 0; i < terms.length; i += 3) s += terms[i]! * Math.cos(terms[i + 1]! + terms[i + 2]! * tau);
  return s;
}

export interface SunApparent {
  /** Apparent geocentric ecliptic longitude and latitude (true equinox of date), radians. */
  longitude: number;
  latitude: number;
  /** Apparent right ascension [0, 2π) and declination, radians, true equator of date. */
  ra: number;
  dec: number;
  /** Earth–Sun distance, au. */
  distanceAu: number;
}

/** Apparent place of the Sun for T Julian centuries of TT; pass nutation if already known. */
export function sunApparent(T: number, nut: Nutation = nutation(T)): SunApparent {
  const tau = T / 10;
  const L =
    (series(L0, tau) +
      tau *
        (series(L1, tau) +
          tau * (series(L2, tau) + tau * (series(L3, tau) + tau * (series(L4, tau) + tau * series(L5, tau)))))) /
    1e8;
  const B = (series(B0, tau) + tau * series(B1, tau)) / 1e8;
  const R =
    (series(R0, tau) +
      tau * (series(R1, tau) + tau * (series(R2, tau) + tau * (series(R3, tau) + tau * series(R4, tau))))) /
    1e8;

  let lon = L + Math.PI; // geocentric = heliocentric Earth + 180°
  let lat = -B;
  // Conversion to the FK5 system (Meeus 25.9).
  const lp = lon - (1.397 * T + 0.00031 * T * T) * DEG;
  lon += -0.09033 * ARCSEC;
  lat += 0.03916 * ARCSEC * (Math.cos(lp) - Math.sin(lp));
  // Nutation and annual aberration.
  lon += (nut.deltaPsi - 20.4898 / R) * ARCSEC;
  lon = normalizeRadians(lon);

  const eps = meanObliquity(T) + nut.deltaEpsilon * ARCSEC;
  const ra = normalizeRadians(Math.atan2(Math.sin(lon) * Math.cos(eps) - Math.tan(lat) * Math.sin(eps), Math.cos(lon)));
  const dec = Math.asin(Math.sin(lat) * Math.cos(eps) + Math.cos(lat) * Math.sin(eps) * Math.sin(lon));
  return { longitude: lon, latitude: lat, ra, dec, distanceAu: R };
}

export interface SunPosition {
  raDeg: number;
  decDeg: number;
  distanceAu: number;
  /** Apparent ecliptic longitude, degrees. */
  longitudeDeg: number;
}

/** Apparent geocentric place of the Sun at a UTC instant. */
export function sunPosition(t: Instant): SunPosition {
  const s = sunApparent(centuriesTT(t));
  return { raDeg: s.ra / DEG, decDeg: s.dec / DEG, distanceAu: s.distanceAu, longitudeDeg: s.longitude / DEG };
}

/** Geometric true longitude ☉ (radians) and orbit elements e, ϖ by the ch. 25 low-accuracy
 * formulas — all that annual aberration (ch. 23) needs. */
export function sunTrueLongitudeLowAccuracy(T: number): {
  trueLongitude: number;
  eccentricity: number;
  perihelion: number;
} {
  const L0d = 280.46646 + 36000.76983 * T + 0.0003032 * T * T;
  const M = (357.52911 + 35999.05029 * T - 0.0001537 * T * T) * DEG;
  const C =
    (1.914602 - 0.004817 * T - 0.000014 * T * T) * Math.sin(M) +
    (0.019993 - 0.000101 * T) * Math.sin(2 * M) +
    0.000289 * Math.sin(3 * M);
  return {
    trueLongitude: normalizeRadians((L0d + C) * DEG),
    eccentricity: 0.016708634 - 0.000042037 * T - 0.0000001267 * T * T,
    perihelion: (102.93735 + 1.71946 * T + 0.00046 * T * T) * DEG,
  };
}
