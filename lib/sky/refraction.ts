// Optional atmospheric refraction: Sæmundsson (1986) in Meeus 16.4, scaled for pressure and
// temperature as Meeus suggests. Good to ~0.1′ above 5°; near the horizon real refraction
// varies by more than any formula, so plans should not lean on it there.

import { DEG } from "./angles";

export interface Atmosphere {
  pressureHpa: number;
  temperatureC: number;
}

export const STANDARD_ATMOSPHERE: Atmosphere = { pressureHpa: 1010, temperatureC: 10 };

/** Refraction in degrees to add to a true (geometric) altitude in degrees. */
export function refractionDeg(trueAltitudeDeg: number, atmosphere: Atmosphere = STANDARD_ATMOSPHERE): number {
  if (trueAltitudeDeg > 90) return 0;
  // The formula is meant for h ≥ −1°; below that fade it out instead of letting it blow up.
  const h = Math.max(trueAltitudeDeg, -1);
  const arcmin = 1.02 / Math.tan((h + 10.3 / (h + 5.11)) * DEG);
  const fade = trueAltitudeDeg < -1 ? Math.max(0, (trueAltitudeDeg + 5) / 4) : 1;
  const k = (atmosphere.pressureHpa / 1010) * (283 / (273 + atmosphere.temperatureC));
  return (arcmin / 60) * k * fade;
}

/** True altitude whose refracted (apparent) altitude is the given one, degrees. */
export function trueFromApparentAltitude(apparentDeg: number, atmosphere: Atmosphere = STANDARD_ATMOSPHERE): number {
  let h = apparentDeg;
  for (let i = 0; i < 6; i++) h = apparentDeg - refractionDeg(h, atmosphere);
  return h;
}
