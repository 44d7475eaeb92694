import { feasibilityInputSchema, type FeasibilityInput } from "../schemas";
import type { TooRequest } from "../types";

/** A stored request as the feasibility check's input, or null while it is incomplete. */
export function feasibilityInputOf(r: TooRequest): FeasibilityInput | null {
  const parsed = feasibilityInputSchema.safeParse({
    target: {
      kind: r.target.kind,
      ra: r.target.raDeg ?? undefined,
      dec: r.target.decDeg ?? undefined,
      ephemeris: r.target.ephemeris ?? undefined,
      hMag: r.target.hMag,
      gSlope: r.target.gSlope,
    },
    telescopeIds: r.telescopes.map((t) => t.id),
    instrumentId: r.instrumentId ?? undefined,
    durationMinutes: r.durationMinutes ?? "",
    earliestStart: r.earliestStart ?? "",
    latestEnd: r.latestEnd ?? "",
    deadline: r.deadline ?? "",
    constraints: {
      maxAirmass: r.constraints.maxAirmass,
      darkness: r.constraints.darkness,
      minMoonSeparationDeg: r.constraints.minMoonSeparationDeg,
      maxMoonIllumination: r.constraints.maxMoonIllumination,
    },
  });
  return parsed.success ? parsed.data : null;
}
