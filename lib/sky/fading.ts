// The fading clock. Apparent magnitude of an asteroid-like body by the IAU H–G system
// (Bowell et al. 1989, in Asteroids II, pp. 524–556):
//   V = H + 5 log10(r Δ) − 2.5 log10[(1 − G) Φ1(α) + G Φ2(α)],
//   Φi = exp(−Ai tan(α/2)^Bi), A1 = 3.33, B1 = 0.63, A2 = 1.87, B2 = 1.22,
// r and Δ in au, α the Sun–target–observer phase angle. Then: when does the target become
// fainter than an instrument's limiting magnitude?

import { DEG } from "./angles";
import type { Ephemeris } from "./ephemeris";
import { sunPosition } from "./sun";
import type { Instant } from "./time-scales";

/** IAU H–G apparent magnitude; phase angle in degrees (valid 0–120°). */
export function magnitudeHG(H: number, G: number, rAu: number, deltaAu: number, phaseAngleDeg: number): number {
  const t = Math.tan((phaseAngleDeg * DEG) / 2);
  const phi1 = Math.exp(-3.33 * Math.pow(t, 0.63));
  const phi2 = Math.exp(-1.87 * Math.pow(t, 1.22));
  return H + 5 * Math.log10(rAu * deltaAu) - 2.5 * Math.log10((1 - G) * phi1 + G * phi2);
}

/** Phase angle (degrees) from the triangle Sun–target–Earth: r, Δ and the Earth–Sun distance R. */
export function phaseAngleDeg(rAu: number, deltaAu: number, earthSunAu: number): number {
  const c = (rAu * rAu + deltaAu * deltaAu - earthSunAu * earthSunAu) / (2 * rAu * deltaAu);
  return Math.acos(Math.max(-1, Math.min(1, c))) / DEG;
}

export interface FadingInput {
  ephemeris: Ephemeris;
  /** Absolute magnitude H; without it the table's own magnitudes are used. */
  H?: number;
  /** Slope parameter G; 0.15 when unknown (the usual default). */
  G?: number;
  limitingMagnitude: number;
  /** Start looking from here (default: the first row). */
  from?: Instant;
}

export interface FadingClock {
  /** Which magnitudes were used. */
  source: "H-G" | "ephemeris";
  magnitudeAtStart: number | null;
  /** First instant at or after `from` when the target is fainter than the limit, or null if
   * it stays brighter to the end of the table (or the magnitudes are unknown). */
  fainterThanLimitAt: Instant | null;
  /** True when it is already fainter than the limit at `from`. */
  alreadyFainter: boolean;
  /** Last instant the table covers: the clock cannot see beyond it. */
  coverageEnd: Instant;
  curve: { time: Instant; magnitude: number }[];
}

/** Apparent magnitude at t from the ephemeris (H–G when H given, else the table). */
export function magnitudeAt(input: FadingInput, t: Instant): number | null {
  const { ephemeris, H } = input;
  if (H === undefined) return ephemeris.magnitudeAt(t);
  const s = ephemeris.at(t);
  if (!s || s.rAu === null || s.deltaAu === null) return null;
  const R = sunPosition(t).distanceAu;
  return magnitudeHG(H, input.G ?? 0.15, s.rAu, s.deltaAu, phaseAngleDeg(s.rAu, s.deltaAu, R));
}

export function fadingClock(input: FadingInput): FadingClock {
  const { ephemeris, limitingMagnitude } = input;
  const from = Math.max(input.from ?? ephemeris.start, ephemeris.start);
  const source = input.H === undefined ? "ephemeris" : "H-G";
  const times = [from, ...ephemeris.rows.map((r) => r.time).filter((t) => t > from)];
  const curve: { time: Instant; magnitude: number }[] = [];
  for (const time of times) {
    const magnitude = magnitudeAt(input, time);
    if (magnitude !== null) curve.push({ time, magnitude });
  }
  const start = magnitudeAt(input, from);
  const base = { source, magnitudeAtStart: start, coverageEnd: ephemeris.end, curve } as const;
  if (start === null) return { ...base, fainterThanLimitAt: null, alreadyFainter: false };
  if (start > limitingMagnitude) return { ...base, fainterThanLimitAt: from, alreadyFainter: true };
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1]!;
    const b = curve[i]!;
    if (a.magnitude <= limitingMagnitude && b.magnitude > limitingMagnitude) {
      // Bisect on the interpolated magnitude to one second.
      let lo = a.time;
      let hi = b.time;
      while (hi - lo > 1000) {
        const m = (lo + hi) / 2;
        const v = magnitudeAt(input, m);
        if (v !== null && v > limitingMagnitude) hi = m;
        else lo = m;
      }
      return { ...base, fainterThanLimitAt: hi, alreadyFainter: false };
    }
  }
  return { ...base, fainterThanLimitAt: null, alreadyFainter: false };
}
