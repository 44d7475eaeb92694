// Shared test helpers: a seeded random source, sexagesimal splitting, and AE time helpers.

import * as AE from "astronomy-engine";

/** Deterministic PRNG (mulberry32) so every run checks the same cases. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Degrees → [h, m, s] of time. */
export function toHms(deg: number): [number, number, number] {
  const h = (((deg % 360) + 360) % 360) / 15;
  const H = Math.floor(h);
  const m = Math.floor((h - H) * 60);
  return [H, m, ((h - H) * 60 - m) * 60];
}

/** |degrees| → [d, m, s] of arc. */
export function toDms(deg: number): [number, number, number] {
  const d = Math.abs(deg);
  const D = Math.floor(d);
  const m = Math.floor((d - D) * 60);
  return [D, m, ((d - D) * 60 - m) * 60];
}

export const hours = (h: number, m: number, s: number) => (h + m / 60 + s / 3600) * 15;
export const degrees = (d: number, m: number, s: number) => d + m / 60 + s / 3600;

/** An astronomy-engine time whose TT equals the given Julian Ephemeris Day. */
export function aeTimeFromJde(jde: number): AE.AstroTime {
  const tt = jde - 2451545.0;
  let ut = tt;
  for (let i = 0; i < 5; i++) ut = tt - AE.DeltaT_EspenakMeeus(ut) / 86400;
  return new AE.AstroTime(ut);
}
