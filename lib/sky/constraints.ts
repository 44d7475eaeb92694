// What a telescope can do and what a request asks for, and the single set of limits the
// window finder works with. Altitude limits are compared with geometric altitudes; when
// refraction is switched on, a telescope's altitude limits are read as observed
// (refracted) altitudes and turned into geometric ones here, once.

import { DEG } from "./angles";
import { altitudeForAirmass } from "./airmass";
import type { Ephemeris } from "./ephemeris";
import { type Atmosphere, STANDARD_ATMOSPHERE, trueFromApparentAltitude } from "./refraction";
import { DARKNESS_SUN_ALTITUDE, type Darkness } from "./twilight";

export interface TelescopeLimits {
  /** Lowest altitude the telescope may point at, degrees. */
  minAltitudeDeg: number;
  /** Highest altitude (zenith blind spot of alt-az mounts), degrees. */
  maxAltitudeDeg?: number;
  /** Largest airmass the telescope accepts (Kasten & Young). */
  maxAirmass?: number;
  /** Hour-angle range of an equatorial mount, hours, −12…+12 (min < max). */
  hourAngleHours?: { min: number; max: number };
  /** Declination range the mount can reach, degrees. */
  declinationDeg?: { min: number; max: number };
  /** Never point closer than this to the Sun, degrees. */
  sunAvoidanceDeg: number;
}

export interface RequestConstraints {
  darkness: Darkness;
  maxAirmass?: number;
  /** Only while the Moon is above the horizon: a set Moon does not constrain. */
  minMoonSeparationDeg?: number;
  /** Only while the Moon is above the horizon; fraction 0…1. */
  maxMoonIllumination?: number;
  /** Drop windows shorter than this. */
  minWindowMinutes?: number;
}

export interface PlanOptions {
  /** Refract altitudes (telescope altitude limits become observed altitudes). Default off. */
  refraction?: Atmosphere | boolean;
  /** Sampling step for moving targets, minutes (default 1). Fixed targets are solved exactly. */
  stepMinutes?: number;
}

export interface FixedTarget {
  kind: "fixed";
  /** ICRS/J2000 right ascension and declination, degrees. */
  raDeg: number;
  decDeg: number;
  pmRaMasPerYr?: number;
  pmDecMasPerYr?: number;
}

export interface MovingTarget {
  kind: "ephemeris";
  ephemeris: Ephemeris;
}

export type Target = FixedTarget | MovingTarget;

export interface EffectiveLimits {
  /** sin of the lowest and highest geometric altitude allowed. */
  sinMinAltitude: number;
  sinMaxAltitude: number | null;
  minAltitudeDeg: number;
  /** Hour-angle band in radians, or null for none. */
  hourAngle: { min: number; max: number } | null;
  declination: { min: number; max: number } | null;
  sunAvoidanceDeg: number;
  cosSunAvoidance: number;
  darknessSunAltitudeDeg: number;
  minMoonSeparationDeg: number | null;
  maxMoonIllumination: number | null;
  minWindowMs: number;
}

export function effectiveLimits(
  telescope: TelescopeLimits,
  constraints: RequestConstraints,
  options: PlanOptions = {},
): EffectiveLimits {
  const atmosphere: Atmosphere | null =
    options.refraction === true ? STANDARD_ATMOSPHERE : options.refraction ? options.refraction : null;
  const geometric = (observed: number) => (atmosphere ? trueFromApparentAltitude(observed, atmosphere) : observed);
  const candidates = [geometric(telescope.minAltitudeDeg)];
  if (telescope.maxAirmass !== undefined) candidates.push(altitudeForAirmass(telescope.maxAirmass));
  if (constraints.maxAirmass !== undefined) candidates.push(altitudeForAirmass(constraints.maxAirmass));
  const minAltitudeDeg = Math.max(...candidates);
  const maxAlt = telescope.maxAltitudeDeg === undefined ? null : geometric(telescope.maxAltitudeDeg);
  const ha = telescope.hourAngleHours;
  return {
    sinMinAltitude: Math.sin(minAltitudeDeg * DEG),
    sinMaxAltitude: maxAlt === null || maxAlt >= 90 ? null : Math.sin(maxAlt * DEG),
    minAltitudeDeg,
    hourAngle: ha ? { min: ha.min * 15 * DEG, max: ha.max * 15 * DEG } : null,
    declination: telescope.declinationDeg ? { ...telescope.declinationDeg } : null,
    sunAvoidanceDeg: telescope.sunAvoidanceDeg,
    cosSunAvoidance: Math.cos(telescope.sunAvoidanceDeg * DEG),
    darknessSunAltitudeDeg: DARKNESS_SUN_ALTITUDE[constraints.darkness],
    minMoonSeparationDeg: constraints.minMoonSeparationDeg ?? null,
    maxMoonIllumination: constraints.maxMoonIllumination ?? null,
    minWindowMs: (constraints.minWindowMinutes ?? 0) * 60_000,
  };
}
