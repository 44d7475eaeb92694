// ICRS/J2000 catalogue place → apparent place on the true equator and equinox of date:
// proper motion (linear in RA/Dec, as Meeus ch. 23), precession (ch. 21), nutation
// (ch. 22) and annual aberration (ch. 23, with the e-terms, as a velocity vector added to
// the direction). Left out, each below 0.05″ for targets away from the Sun's limb: the
// ICRS–FK5 frame bias, light deflection, diurnal aberration and stellar parallax.
//
// All of this changes by < 0.2″ in a night, so a night is served by one DateFrame.

import { ARCSEC, DEG } from "./angles";
import { meanObliquity, type Nutation, nutation } from "./nutation";
import { precessionMatrix } from "./precession";
import { sunTrueLongitudeLowAccuracy } from "./sun";
import { centuriesTT, type Instant } from "./time-scales";
import { type Mat3, mulMat, mulMatVec, normalize, rotX, rotZ, toSpherical, unitVector, type Vec3 } from "./vectors";

/** Constant of aberration κ (Meeus ch. 23). */
const KAPPA = 20.49552 * ARCSEC;

export interface DateFrame {
  /** Julian centuries of TT at which the frame was built. */
  T: number;
  nutation: Nutation;
  /** True obliquity of the ecliptic, radians. */
  trueObliquity: number;
  /** J2000 mean equator → true equator and equinox of date (nutation × precession). */
  matrix: Mat3;
  /** Earth's velocity over c in the true equator of date (annual aberration). */
  aberration: Vec3;
  /** Equation of the equinoxes Δψ cos ε, radians (apparent − mean sidereal time). */
  equationOfEquinoxes: number;
}

/** Nutation matrix: mean equator of date → true equator of date. */
export function nutationMatrix(T: number, nut: Nutation): Mat3 {
  const eps0 = meanObliquity(T);
  const eps = eps0 + nut.deltaEpsilon * ARCSEC;
  return mulMat(rotX(eps), mulMat(rotZ(nut.deltaPsi * ARCSEC), rotX(-eps0)));
}

/** Earth's velocity / c in the true equator of date from Meeus 23.3 (κ, ☉, e, ϖ). */
export function aberrationVector(T: number, trueObliquity: number): Vec3 {
  const { trueLongitude: sun, eccentricity: e, perihelion: pi } = sunTrueLongitudeLowAccuracy(T);
  const x = KAPPA * (Math.sin(sun) - e * Math.sin(pi));
  const y = -KAPPA * (Math.cos(sun) - e * Math.cos(pi));
  return [x, y * Math.cos(trueObliquity), y * Math.sin(trueObliquity)];
}

export function dateFrame(T: number, nut: Nutation = nutation(T)): DateFrame {
  const trueObliquity = meanObliquity(T) + nut.deltaEpsilon * ARCSEC;
  return {
    T,
    nutation: nut,
    trueObliquity,
    matrix: mulMat(nutationMatrix(T, nut), precessionMatrix(T)),
    aberration: aberrationVector(T, trueObliquity),
    equationOfEquinoxes: nut.deltaPsi * ARCSEC * Math.cos(trueObliquity),
  };
}

export interface ProperMotion {
  /** μα* = μα cos δ, milliarcseconds per Julian year. */
  pmRaMasPerYr?: number;
  /** μδ, milliarcseconds per Julian year. */
  pmDecMasPerYr?: number;
}

/** J2000 direction of a catalogue star moved by proper motion to T (epoch J2000.0). */
export function catalogueDirection(raRad: number, decRad: number, T: number, pm: ProperMotion = {}): Vec3 {
  const years = T * 100;
  const cosDec = Math.cos(decRad);
  const dRa = cosDec > 1e-12 ? ((pm.pmRaMasPerYr ?? 0) / 1000 / cosDec) * ARCSEC * years : 0;
  const dDec = ((pm.pmDecMasPerYr ?? 0) / 1000) * ARCSEC * years;
  return unitVector(raRad + dRa, decRad + dDec);
}

/** Geocentric apparent direction (unit vector, true equator of date) of a J2000 direction. */
export function apparentDirection(frame: DateFrame, j2000: Vec3): Vec3 {
  const v = mulMatVec(frame.matrix, j2000);
  const b = frame.aberration;
  return normalize([v[0] + b[0], v[1] + b[1], v[2] + b[2]]);
}

/** Apparent place of a fixed target at a UTC instant, degrees. */
export function apparentPlace(
  raDeg: number,
  decDeg: number,
  t: Instant,
  pm: ProperMotion = {},
): { raDeg: number; decDeg: number } {
  return apparentPlaceAt(raDeg, decDeg, centuriesTT(t), pm);
}

/** Apparent place for T Julian centuries of TT (the book's examples are given in TD). */
export function apparentPlaceAt(
  raDeg: number,
  decDeg: number,
  T: number,
  pm: ProperMotion = {},
): { raDeg: number; decDeg: number } {
  const frame = dateFrame(T);
  const { lon, lat } = toSpherical(apparentDirection(frame, catalogueDirection(raDeg * DEG, decDeg * DEG, T, pm)));
  return { raDeg: lon / DEG, decDeg: lat / DEG };
}

/** Mean place of date (precession and proper motion only), degrees — Meeus ex. 21.b. */
export function meanPlaceAt(
  raDeg: number,
  decDeg: number,
  T: number,
  pm: ProperMotion = {},
): { raDeg: number; decDeg: number } {
  const v = mulMatVec(precessionMatrix(T), catalogueDirection(raDeg * DEG, decDeg * DEG, T, pm));
  const { lon, lat } = toSpherical(v);
  return { raDeg: lon / DEG, decDeg: lat / DEG };
}
