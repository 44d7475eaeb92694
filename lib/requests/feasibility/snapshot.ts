import type { FeasibilityReport, FeasibilitySnapshot } from "./types";

/** What is kept with a filed request: the verdicts and windows, not the chart samples. */
export function toSnapshot(report: FeasibilityReport): FeasibilitySnapshot {
  const { skies: _skies, fading, ...rest } = report;
  if (!fading) return { ...rest, fading: null };
  const { curve: _curve, ...kept } = fading;
  return { ...rest, fading: kept };
}
