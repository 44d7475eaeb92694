// General precession from J2000.0 to the mean equator and equinox of date: IAU 1976
// angles ζ, z, θ (Lieske et al. 1977) as given by Meeus, ch. 21 (21.3). Over ±50 years
// they differ from the IAU 2006 model by < 0.2″, far below anything a telescope plan needs.

import { ARCSEC } from "./angles";
import { type Mat3, mulMat, rotY, rotZ } from "./vectors";

/** Precession angles ζ, z, θ in radians for T Julian centuries of TT from J2000.0. */
export function precessionAngles(T: number): { zeta: number; z: number; theta: number } {
  const T2 = T * T;
  const T3 = T2 * T;
  return {
    zeta: (2306.2181 * T + 0.30188 * T2 + 0.017998 * T3) * ARCSEC,
    z: (2306.2181 * T + 1.09468 * T2 + 0.018203 * T3) * ARCSEC,
    theta: (2004.3109 * T - 0.42665 * T2 - 0.041833 * T3) * ARCSEC,
  };
}

/** Matrix taking a J2000 mean-equator vector to the mean equator and equinox of date. */
export function precessionMatrix(T: number): Mat3 {
  const { zeta, z, theta } = precessionAngles(T);
  // Meeus 21.4 written as rotations: RA += ζ, tilt by θ, RA += z.
  return mulMat(rotZ(z), mulMat(rotY(-theta), rotZ(zeta)));
}
