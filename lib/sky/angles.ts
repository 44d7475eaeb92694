// Angle units and wrapping. Radians inside the engine, degrees at its edges.

export const DEG = Math.PI / 180;
export const RAD = 180 / Math.PI;
export const ARCSEC = DEG / 3600;
export const TWO_PI = 2 * Math.PI;

/** Degrees into [0, 360). */
export function normalizeDegrees(deg: number): number {
  const r = deg % 360;
  return r < 0 ? r + 360 : r === 360 ? 0 : r;
}

/** Radians into [0, 2π). */
export function normalizeRadians(rad: number): number {
  const r = rad % TWO_PI;
  return r < 0 ? r + TWO_PI : r;
}

/** Radians into (−π, π]. */
export function wrapPi(rad: number): number {
  let r = rad % TWO_PI;
  if (r <= -Math.PI) r += TWO_PI;
  else if (r > Math.PI) r -= TWO_PI;
  return r;
}

/** Degrees into (−180, 180]. */
export function wrap180(deg: number): number {
  return wrapPi(deg * DEG) * RAD;
}
