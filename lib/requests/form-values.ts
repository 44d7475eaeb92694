/**
 * The request form's values: a fresh form's defaults, a stored draft shown back, and the
 * part of the values the live feasibility preview needs. Form values are strings (empty
 * boxes are ""), times are UT wall-clock text for datetime-local inputs.
 */
import { toUtInputValue } from "@/lib/validation/fields";
import type { RequestFormValues } from "./schemas";
import type { TooRequest } from "./types";

const HOUR = 3_600_000;

/** A new request: starting now (to the next 5 minutes), a three-day window, tonight's urgency. */
export function emptyRequestForm(now: Date, programIds: string[]): RequestFormValues {
  const start = Math.ceil(now.getTime() / (5 * 60_000)) * 5 * 60_000;
  const end = toUtInputValue(new Date(start + 72 * HOUR));
  return {
    programId: programIds.length === 1 ? programIds[0]! : "",
    targetName: "",
    target: { kind: "fixed", ra: "", dec: "", hMag: "", gSlope: "" },
    telescopeIds: [],
    instrumentId: "",
    durationMinutes: "60",
    earliestStart: toUtInputValue(new Date(start)),
    latestEnd: end,
    deadline: end,
    urgency: "tonight",
    constraints: { maxAirmass: "2", darkness: "nautical", minMoonSeparationDeg: "", maxMoonIllumination: "" },
    justification: "",
  };
}

const text = (n: number | null) => (n === null ? "" : String(n));
const time = (d: Date | null) => (d === null ? "" : toUtInputValue(d));

/** A stored request back into the form, as far as it was filled in. */
export function requestFormValues(r: TooRequest): RequestFormValues {
  return {
    programId: r.programId ?? "",
    targetName: r.targetName,
    target: {
      kind: r.target.kind,
      ra: r.target.raText,
      dec: r.target.decText,
      ephemeris: r.target.ephemeris ?? undefined,
      hMag: text(r.target.hMag),
      gSlope: text(r.target.gSlope),
    },
    telescopeIds: r.telescopes.map((t) => t.id),
    instrumentId: r.instrumentId ?? "",
    durationMinutes: text(r.durationMinutes),
    earliestStart: time(r.earliestStart),
    latestEnd: time(r.latestEnd),
    deadline: time(r.deadline),
    urgency: r.urgency ?? "tonight",
    constraints: {
      maxAirmass: text(r.constraints.maxAirmass),
      darkness: r.constraints.darkness,
      minMoonSeparationDeg: text(r.constraints.minMoonSeparationDeg),
      maxMoonIllumination: text(r.constraints.maxMoonIllumination),
    },
    justification: r.justification,
  };
}

/** The fields that decide observability, for POST /api/v1/too-requests/feasibility. */
export function feasibilityBody(values: { [K in keyof RequestFormValues]?: unknown }) {
  return {
    target: values.target,
    telescopeIds: values.telescopeIds,
    instrumentId: values.instrumentId,
    durationMinutes: values.durationMinutes,
    earliestStart: values.earliestStart,
    latestEnd: values.latestEnd,
    deadline: values.deadline,
    constraints: values.constraints,
  };
}
