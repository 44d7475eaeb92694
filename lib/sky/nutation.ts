// Nutation in longitude and obliquity: IAU 1980 theory as tabulated by Meeus,
// Astronomical Algorithms 2nd ed., ch. 22 (table 22.A, all 63 terms), and the mean
// obliquity of the ecliptic (Laskar's 22.2 is not used; 22.2 here is the IAU formula).
// Chosen over IAU 2000B so the book's worked examples reproduce to the printed digit;
// the two theories differ by a few hundredths of an arcsecond.

import { ARCSEC, DEG } from "./angles";

// Rows: multiples of D, M, M′, F, Ω; then Δψ sine coefficient (0.0001″) and its rate per
// century; then Δε cosine coefficient and its rate.
// prettier-ignore
const TERMS: readonly number[] = [
  0, 0, 0, 0, 1, -171996, -174.2, 92025, 8.9,
  -2, 0, 0, 2, 2, -13187, -1.6, 5736, -3.1,
  0, 0, 0, 2, 2, -2274, -0.2, 977, -0.5,
  0, 0, 0, 0, 2, 2062, 0.2, -895, 0.5,
  0, 1, 0, 0, 0, 1426, -3.4, 54, -0.1,
  0, 0, 1, 0, 0, 712, 0.1, -7, 0,
  -2, 1, 0, 2, 2, -517, 1.2, 224, -0.6,
  0, 0, 0, 2, 1, -386, -0.4, 200, 0,
  0, 0, 1, 2, 2, -301, 0, 129, -0.1,
  -2, -1, 0, 2, 2, 217, -0.5, -95, 0.3,
  -2, 0, 1, 0, 0, -158, 0, 0, 0,
  -2, 0, 0, 2, 1, 129, 0.1, -70, 0,
  0, 0, -1, 2, 2, 123, 0, -53, 0,
  2, 0, 0, 0, 0, 63, 0, 0, 0,
  0, 0, 1, 0, 1, 63, 0.1, -33, 0,
  2, 0, -1, 2, 2, -59, 0, 26, 0,
  0, 0, -1, 0, 1, -58, -0.1, 32, 0,
  0, 0, 1, 2, 1, -51, 0, 27, 0,
  -2, 0, 2, 0, 0, 48, 0, 0, 0,
  0, 0, -2, 2, 1, 46, 0, -24, 0,
  2, 0, 0, 2, 2, -38, 0, 16, 0,
  0, 0, 2, 2, 2, -31, 0, 13, 0,
  0, 0, 2, 0, 0, 29, 0, 0, 0,
  -2, 0, 1, 2, 2, 29, 0, -12, 0,
  0, 0, 0, 2, 0, 26, 0, 0, 0,
  -2, 0, 0, 2, 0, -22, 0, 0, 0,
  0, 0, -1, 2, 1, 21, 0, -10, 0,
  0, 2, 0, 0, 0, 17, -0.1, 0, 0,
  2, 0, -1, 0, 1, 16, 0, -8, 0,
  -2, 2, 0, 2, 2, -16, 0.1, 7, 0,
  0, 1, 0, 0, 1, -15, 0, 9, 0,
  -2, 0, 1, 0, 1, -13, 0, 7, 0,
  0, -1, 0, 0, 1, -12, 0, 6, 0,
  0, 0, 2, -2, 0, 11, 0, 0, 0,
  2, 0, -1, 2, 1, -10, 0, 5, 0,
  2, 0, 1, 2, 2, -8, 0, 3, 0,
  0, 1, 0, 2, 2, 7, 0, -3, 0,
  -2, 1, 1, 0, 0, -7, 0, 0, 0,
  0, -1, 0, 2, 2, -7, 0, 3, 0,
  2, 0, 0, 2, 1, -7, 0, 3, 0,
  2, 0, 1, 0, 0, 6, 0, 0, 0,
  -2, 0, 2, 2, 2, 6, 0, -3, 0,
  -2, 0, 1, 2, 1, 6, 0, -3, 0,
  2, 0, -2, 0, 1, -6, 0, 3, 0,
  2, 0, 0, 0, 1, -6, 0, 3, 0,
  0, -1, 1, 0, 0, 5, 0, 0, 0,
  -2, -1, 0, 2, 1, -5, 0, 3, 0,
  -2, 0, 0, 0, 1, -5, 0, 3, 0,
  0, 0, 2, 2, 1, -5, 0, 3, 0,
  -2, 0, 2, 0, 1, 4, 0, 0, 0,
  -2, 1, 0, 2, 1, 4, 0, 0, 0,
  0, 0, 1, -2, 0, 4, 0, 0, 0,
  -1, 0, 1, 0, 0, -4, 0, 0, 0,
  -2, 1, 0, 0, 0, -4, 0, 0, 0,
  1, 0, 0, 0, 0, -4, 0, 0, 0,
  0, 0, 1, 2, 0, 3, 0, 0, 0,
  0, 0, -2, 2, 2, -3, 0, 0, 0,
  -1, -1, 1, 0, 0, -3, 0, 0, 0,
  0, 1, 1, 0, 0, -3, 0, 0, 0,
  0, -1, 1, 2, 2, -3, 0, 0, 0,
  2, -1, -1, 2, 2, -3, 0, 0, 0,
  0, 0, 3, 2, 2, -3, 0, 0, 0,
  2, -1, 0, 2, 2, -3, 0, 0, 0,
];
const ROW = 9;

export interface Nutation {
  /** Nutation in longitude Δψ, arcseconds. */
  deltaPsi: number;
  /** Nutation in obliquity Δε, arcseconds. */
  deltaEpsilon: number;
}

/** Fundamental lunisolar arguments D, M, M′, F, Ω in degrees (Meeus 22, p. 144). */
export function fundamentalArguments(T: number): [number, number, number, number, number] {
  const T2 = T * T;
  const T3 = T2 * T;
  return [
    297.85036 + 445267.11148 * T - 0.0019142 * T2 + T3 / 189474,
    357.52772 + 35999.05034 * T - 0.0001603 * T2 - T3 / 300000,
    134.96298 + 477198.867398 * T + 0.0086972 * T2 + T3 / 56250,
    93.27191 + 483202.017538 * T - 0.0036825 * T2 + T3 / 327270,
    125.04452 - 1934.136261 * T + 0.0020708 * T2 + T3 / 450000,
  ];
}

/** Δψ and Δε for T Julian centuries of TT since J2000.0. */
export function nutation(T: number): Nutation {
  const [D, M, Mp, F, Om] = fundamentalArguments(T).map((a) => (a % 360) * DEG) as [
    number,
    number,
    number,
    number,
    number,
  ];
  let dpsi = 0;
  let deps = 0;
  for (let i = 0; i < TERMS.length; i += ROW) {
    const arg = TERMS[i]! * D + TERMS[i + 1]! * M + TERMS[i + 2]! * Mp + TERMS[i + 3]! * F + TERMS[i + 4]! * Om;
    dpsi += (TERMS[i + 5]! + TERMS[i + 6]! * T) * Math.sin(arg);
    deps += (TERMS[i + 7]! + TERMS[i + 8]! * T) * Math.cos(arg);
  }
  return { deltaPsi: dpsi * 1e-4, deltaEpsilon: deps * 1e-4 };
}

/** Mean obliquity of the ecliptic ε0 in radians (IAU, Meeus 22.2). */
export function meanObliquity(T: number): number {
  const arcsec = 84381.448 - 46.815 * T - 0.00059 * T * T + 0.001813 * T * T * T;
  return arcsec * ARCSEC;
}
