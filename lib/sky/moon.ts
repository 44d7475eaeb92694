// The Moon: geocentric apparent place by Meeus ch. 47 (ELP-2000/82 truncated to the terms
// of tables 47.A/B; ~10″ in longitude, ~4″ in latitude), topocentric place by subtracting
// the observer's geocentric vector (parallax up to ~1°), and the illuminated fraction from
// the Sun–Moon–observer phase angle (Meeus ch. 48, exact geometry of 48.2–48.3).

import { ARCSEC, DEG, normalizeRadians } from "./angles";
import { meanObliquity, type Nutation, nutation } from "./nutation";
import { MOON_LAT, MOON_LON_DIST } from "./moon-terms";
import { centuriesTT, type Instant } from "./time-scales";
import { angleBetween, scale, sub, unitVector, type Vec3 } from "./vectors";

export interface MoonApparent {
  /** Apparent ecliptic longitude (with nutation) and latitude, radians. */
  longitude: number;
  latitude: number;
  distanceKm: number;
  /** Apparent geocentric right ascension [0, 2π) and declination, radians. */
  ra: number;
  dec: number;
}

// cos/sin of k·x for k = −4…4, filled by angle addition instead of 9 calls to sin/cos.
function multiples(x: number, c: Float64Array, s: Float64Array): void {
  const c1 = Math.cos(x);
  const s1 = Math.sin(x);
  c[4] = 1;
  s[4] = 0;
  for (let k = 1; k <= 4; k++) {
    const cp = c[3 + k]!;
    const sp = s[3 + k]!;
    c[4 + k] = cp * c1 - sp * s1;
    s[4 + k] = sp * c1 + cp * s1;
    c[4 - k] = c[4 + k]!;
    s[4 - k] = -s[4 + k]!;
  }
}

const cD = new Float64Array(9);
const sD = new Float64Array(9);
const cM = new Float64Array(9);
const sM = new Float64Array(9);
const cMp = new Float64Array(9);
const sMp = new Float64Array(9);
const cF = new Float64Array(9);
const sF = new Float64Array(9);

/** Apparent geocentric place of the Moon for T Julian centuries of TT. */
export function moonApparent(T: number, nut: Nutation = nutation(T)): MoonApparent {
  const T2 = T * T;
  const T3 = T2 * T;
  const T4 = T3 * T;
  const Lp = (218.3164477 + 481267.88123421 * T - 0.0015786 * T2 + T3 / 538841 - T4 / 65194000) % 360;
  const D = (297.8501921 + 445267.1114034 * T - 0.0018819 * T2 + T3 / 545868 - T4 / 113065000) % 360;
  const M = (357.5291092 + 35999.0502909 * T - 0.0001536 * T2 + T3 / 24490000) % 360;
  const Mp = (134.9633964 + 477198.8675055 * T + 0.0087414 * T2 + T3 / 69699 - T4 / 14712000) % 360;
  const F = (93.272095 + 483202.0175233 * T - 0.0036539 * T2 - T3 / 3526000 + T4 / 863310000) % 360;
  const A1 = (119.75 + 131.849 * T) * DEG;
  const A2 = (53.09 + 479264.29 * T) * DEG;
  const A3 = (313.45 + 481266.484 * T) * DEG;
  const E = 1 - 0.002516 * T - 0.0000074 * T2;
  const E2 = E * E;

  multiples(D * DEG, cD, sD);
  multiples(M * DEG, cM, sM);
  multiples(Mp * DEG, cMp, sMp);
  multiples(F * DEG, cF, sF);

  let sl = 0;
  let sr = 0;
  for (let i = 0; i < MOON_LON_DIST.length; i += 6) {
    const m = MOON_LON_DIST[i + 1]!;
    const [c, s] = argument(4 + MOON_LON_DIST[i]!, 4 + m, 4 + MOON_LON_DIST[i + 2]!, 4 + MOON_LON_DIST[i + 3]!);
    const f = m === 0 ? 1 : m === 1 || m === -1 ? E : E2;
    sl += MOON_LON_DIST[i + 4]! * f * s;
    sr += MOON_LON_DIST[i + 5]! * f * c;
  }
  let sb = 0;
  for (let i = 0; i < MOON_LAT.length; i += 5) {
    const m = MOON_LAT[i + 1]!;
    const [, s] = argument(4 + MOON_LAT[i]!, 4 + m, 4 + MOON_LAT[i + 2]!, 4 + MOON_LAT[i + 3]!);
    const f = m === 0 ? 1 : m === 1 || m === -1 ? E : E2;
    sb += MOON_LAT[i + 4]! * f * s;
  }
  const LpR = Lp * DEG;
  const FR = F * DEG;
  const MpR = Mp * DEG;
  // Additive terms: Venus (A1), Jupiter (A2) and the Earth's flattening (L′).
  sl += 3958 * Math.sin(A1) + 1962 * Math.sin(LpR - FR) + 318 * Math.sin(A2);
  sb +=
    -2235 * Math.sin(LpR) +
    382 * Math.sin(A3) +
    175 * Math.sin(A1 - FR) +
    175 * Math.sin(A1 + FR) +
    127 * Math.sin(LpR - MpR) -
    115 * Math.sin(LpR + MpR);

  const longitude = normalizeRadians((Lp + sl / 1e6) * DEG + nut.deltaPsi * ARCSEC);
  const latitude = (sb / 1e6) * DEG;
  const distanceKm = 385000.56 + sr / 1000;
  const eps = meanObliquity(T) + nut.deltaEpsilon * ARCSEC;
  const ra = normalizeRadians(
    Math.atan2(Math.sin(longitude) * Math.cos(eps) - Math.tan(latitude) * Math.sin(eps), Math.cos(longitude)),
  );
  const dec = Math.asin(Math.sin(latitude) * Math.cos(eps) + Math.cos(latitude) * Math.sin(eps) * Math.sin(longitude));
  return { longitude, latitude, distanceKm, ra, dec };
}

// cos and sin of (d·D + m·M + p·M′ + f·F) from the precomputed multiples.
function argument(d: number, m: number, p: number, f: number): [number, number] {
  let c = cD[d]!;
  let s = sD[d]!;
  let c2 = c * cM[m]! - s * sM[m]!;
  let s2 = s * cM[m]! + c * sM[m]!;
  c = c2 * cMp[p]! - s2 * sMp[p]!;
  s = s2 * cMp[p]! + c2 * sMp[p]!;
  c2 = c * cF[f]! - s * sF[f]!;
  s2 = s * cF[f]! + c * sF[f]!;
  return [c2, s2];
}

/** Geocentric apparent Moon at a UTC instant, degrees and km. */
export function moonPosition(t: Instant): {
  raDeg: number;
  decDeg: number;
  distanceKm: number;
  longitudeDeg: number;
  latitudeDeg: number;
} {
  const m = moonApparent(centuriesTT(t));
  return {
    raDeg: m.ra / DEG,
    decDeg: m.dec / DEG,
    distanceKm: m.distanceKm,
    longitudeDeg: m.longitude / DEG,
    latitudeDeg: m.latitude / DEG,
  };
}

/** Geocentric apparent Moon as a vector in km, true equator of date. */
export function moonVectorKm(m: MoonApparent): Vec3 {
  return scale(unitVector(m.ra, m.dec), m.distanceKm);
}

/** Phase angle (radians) at the Moon between the Sun and the observer, both given as
 * vectors from the observer (any common unit). */
export function phaseAngle(sunFromObserver: Vec3, moonFromObserver: Vec3): number {
  return angleBetween(sub(sunFromObserver, moonFromObserver), scale(moonFromObserver, -1));
}

/** Illuminated fraction of the disk from the phase angle (Meeus 48.1). */
export function illuminatedFraction(phaseAngleRad: number): number {
  return (1 + Math.cos(phaseAngleRad)) / 2;
}

/** Phase angle from geocentric elongation ψ and the two distances (Meeus 48.3). */
export function phaseAngleFromElongation(elongationRad: number, sunDistance: number, moonDistance: number): number {
  return Math.atan2(sunDistance * Math.sin(elongationRad), moonDistance - sunDistance * Math.cos(elongationRad));
}
