// Airmass. The working formula is Kasten & Young (1989), Applied Optics 28, 4735:
//   X = 1 / (sin h + 0.50572 (h + 6.07995°)^−1.6364),
// h the true (unrefracted) altitude in degrees; it stays within 0.5 % of their tabulated
// ISO-atmosphere values down to the horizon. The plane-parallel sec z is kept only for
// comparison — it diverges at the horizon. Below the horizon airmass is null, never a
// negative or huge number.

import { DEG } from "./angles";

export function airmassKastenYoung(altitudeDeg: number): number | null {
  if (!(altitudeDeg >= 0)) return null;
  const h = Math.min(altitudeDeg, 90);
  return 1 / (Math.sin(h * DEG) + 0.50572 * Math.pow(h + 6.07995, -1.6364));
}

export function airmassSecZ(altitudeDeg: number): number | null {
  if (!(altitudeDeg > 0)) return null;
  return 1 / Math.sin(Math.min(altitudeDeg, 90) * DEG);
}

/** Lowest altitude (degrees) at which the Kasten & Young airmass is at most `airmass`. */
export function altitudeForAirmass(airmass: number): number {
  if (!(airmass >= 1)) throw new RangeError(`airmass must be at least 1, got ${airmass}`);
  // X(h) falls monotonically from ~37.9 at 0° to ~1.0 at 90°: bisection is exact enough.
  const atZenith = airmassKastenYoung(90)!;
  if (airmass <= atZenith) return 90;
  if (airmass >= airmassKastenYoung(0)!) return 0;
  let lo = 0;
  let hi = 90;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (airmassKastenYoung(mid)! > airmass) lo = mid;
    else hi = mid;
  }
  return hi;
}
