/**
 * Observable windows and the airmass through them for one request on one telescope,
 * from the sky engine: the same telescope limits and request constraints the feasibility
 * check uses (lib/requests/feasibility/inputs), every night from the start of the usable
 * time to its end. Pure; the CPU-heavy part of finding slots.
 */
import { visibilityRequest, visibilityTarget } from "@/lib/requests/feasibility/inputs";
import type { TelescopeSky } from "@/lib/requests/feasibility/types";
import type { FeasibilityInput } from "@/lib/requests/schemas";
import { Ephemeris, nightOfInstant, nightsBetween, Planner, type PlanRequest, type Site, type Target } from "@/lib/sky";
import type { AirmassSample, FinderWindow } from "./types";

/** The airmass is sampled every 10 minutes: a slot of an hour averages six or seven samples. */
export const AIRMASS_STEP_MINUTES = 10;

function targetOf(input: FeasibilityInput["target"]): Target {
  if (input.kind === "fixed") return { kind: "fixed", raDeg: input.ra ?? 0, decDeg: input.dec ?? 0 };
  const rows = (input.ephemeris ?? []).map((r) => ({ time: Date.parse(r.time), raDeg: r.ra, decDeg: r.dec, rAu: r.rAu, deltaAu: r.deltaAu, magnitude: r.magnitude }));
  return { kind: "ephemeris", ephemeris: new Ephemeris(rows) };
}

export interface TelescopeSkyWindows {
  windows: FinderWindow[];
  airmass: AirmassSample[];
}

export function skyWindows(input: FeasibilityInput, telescope: TelescopeSky, usable: { start: number; end: number }): TelescopeSkyWindows {
  if (!(usable.end > usable.start)) return { windows: [], airmass: [] };
  const site: Site = { latitudeDeg: telescope.site.latitudeDeg, longitudeDeg: telescope.site.longitudeDeg, heightM: telescope.site.heightM, timeZone: telescope.site.timeZone };
  const first = nightOfInstant(site, usable.start).nightOf;
  const last = nightOfInstant(site, usable.end - 1).nightOf;
  // Only its telescope limits and constraints are used: the same ones the feasibility check applies.
  const limits = visibilityRequest(input, telescope, visibilityTarget(input.target), { from: first, to: last });
  const request: PlanRequest = { site, target: targetOf(input.target), telescope: limits.telescope, constraints: limits.constraints, options: { refraction: false, stepMinutes: 1 } };
  const planner = new Planner(request);
  const windows: FinderWindow[] = [];
  const airmass: AirmassSample[] = [];
  for (const span of nightsBetween(site, first, last)) {
    const plan = planner.night(span);
    for (const w of plan.windows) {
      const from = Math.max(w.start, usable.start);
      const to = Math.min(w.end, usable.end);
      if (to <= from) continue;
      windows.push({ start: w.start, end: w.end, bestAt: w.bestAt, bestAirmass: w.bestAirmass });
      for (const p of planner.curve(span, AIRMASS_STEP_MINUTES, from, to)) airmass.push({ t: p.time, airmass: p.airmass });
    }
  }
  return { windows, airmass };
}
