/**
 * A request's target and constraints, and a telescope with its site, turned into the body
 * lib/visibility's computeVisibility takes. Built directly in its parsed form: the
 * request's own schema has already checked every value.
 */
import type { VisibilityRequest } from "@/lib/visibility";
import type { FeasibilityInput } from "../schemas";
import type { TelescopeSky } from "./types";

/** Charts sample the sky every 10 minutes: smooth enough for a night's curve, half the work of 5. */
export const CURVE_STEP_MINUTES = 10;

export type When = VisibilityRequest["when"];

export function visibilityTarget(target: FeasibilityInput["target"]): VisibilityRequest["target"] {
  if (target.kind === "fixed") return { kind: "fixed", ra: target.ra ?? 0, dec: target.dec ?? 0 };
  return {
    kind: "ephemeris",
    rows: (target.ephemeris ?? []).map((r) => ({ time: r.time, ra: r.ra, dec: r.dec, rAu: r.rAu, deltaAu: r.deltaAu, magnitude: r.magnitude })),
    // H–G needs r and Δ on every row (the request schema insists); G defaults in the engine.
    absoluteMagnitude: target.hMag,
    slopeG: target.gSlope,
  };
}

function telescopeLimits(t: TelescopeSky): VisibilityRequest["telescope"] {
  const limitsHourAngle = t.hourAngleMinH > -12 || t.hourAngleMaxH < 12;
  // A mount limited to the meridian alone still needs min < max for the engine.
  const hourAngleHours = limitsHourAngle ? { min: t.hourAngleMinH, max: Math.max(t.hourAngleMaxH, t.hourAngleMinH + 1e-6) } : undefined;
  return { name: t.name, minAltitudeDeg: t.minAltitudeDeg, maxAirmass: t.maxAirmass, sunAvoidanceDeg: t.sunAvoidanceDeg, hourAngleHours };
}

export function visibilityRequest(input: FeasibilityInput, telescope: TelescopeSky, target: VisibilityRequest["target"], when: When): VisibilityRequest {
  const c = input.constraints;
  return {
    site: {
      name: telescope.site.name,
      latitudeDeg: telescope.site.latitudeDeg,
      longitudeDeg: telescope.site.longitudeDeg,
      heightM: telescope.site.heightM,
      timeZone: telescope.site.timeZone,
    },
    telescope: telescopeLimits(telescope),
    target,
    constraints: {
      darkness: c.darkness,
      maxAirmass: c.maxAirmass,
      minMoonSeparationDeg: c.minMoonSeparationDeg,
      maxMoonIllumination: c.maxMoonIllumination,
    },
    when,
    options: { refraction: false, stepMinutes: 1, curveStepMinutes: CURVE_STEP_MINUTES },
  };
}
