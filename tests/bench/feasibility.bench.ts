// Feasibility benchmark — prints figures, asserts nothing
// (run: node_modules/.bin/tsx tests/bench/feasibility.bench.ts).
//
// In-process, one Node thread, 16 concurrent callers in a closed loop: each issues a
// request, waits for its answer, issues the next. Latency runs from issue to answer, so
// it includes the wait behind the other callers — what a single app process would show.
//   A. computeVisibility for three telescopes over a 3-night window (one range call each).
//   B. The request form's preview as POST /api/v1/too-requests/feasibility computes it:
//      the same three telescopes and nights plus airmass curves for the charts.
//   C. B for a moving target (hourly ephemeris with r and Δ, and the fading clock).
//   D. B as the API runs it, through the per-night cache, while PIs change only the time
//      needed and the deadline of their requests (the target and nights stay the same).
// Target (the issue's, for the full HTTP round trip): p95 under 150 ms with 16 clients.
// The HTTP round trip adds JSON, auth and the telescope query; measure it separately.

import { cachedVisibility } from "../../lib/requests/feasibility/cache";
import { computeFeasibility } from "../../lib/requests/feasibility/compute";
import type { InstrumentRef, TelescopeSky } from "../../lib/requests/feasibility/types";
import { feasibilityInputSchema } from "../../lib/requests/schemas";
import { computeVisibility, type VisibilityRequest, visibilityRequestSchema } from "../../lib/visibility";
import { percentile } from "./bench-support";

const CALLERS = 16;
const ROUNDS = 12; // answers per caller
const FROM = "2027-03-10";
const NOW = new Date(`${FROM}T15:00:00Z`);
const HOUR = 3_600_000;

// Invented sites and telescopes, shaped like the demo consortium's.
const south = { id: "s1", code: "SX", name: "Invented south station", latitudeDeg: -30.5, longitudeDeg: -70.4, heightM: 2300, timeZone: "America/Santiago" };
const north = { id: "s2", code: "NX", name: "Invented north station", latitudeDeg: 38.4, longitudeDeg: -3.7, heightM: 1850, timeZone: "Europe/Madrid" };
const telescopes: TelescopeSky[] = [
  { id: "t1", code: "SX41", name: "South 4.1 m", minAltitudeDeg: 25, maxAirmass: 2.4, sunAvoidanceDeg: 45, hourAngleMinH: -5, hourAngleMaxH: 5, site: south },
  { id: "t2", code: "SX16", name: "South 1.6 m", minAltitudeDeg: 20, maxAirmass: 2.9, sunAvoidanceDeg: 30, hourAngleMinH: -6, hourAngleMaxH: 6, site: south },
  { id: "t3", code: "NX25", name: "North 2.5 m", minAltitudeDeg: 22, maxAirmass: 2.7, sunAvoidanceDeg: 40, hourAngleMinH: -5.5, hourAngleMaxH: 5.5, site: north },
];
const instrument: InstrumentRef = { id: "i1", telescopeId: "t2", code: "CAMX", name: "Invented camera", limitingMagnitude: 21.9 };

/** A different target per call, so nothing is answered from a warm path by accident. */
function raFor(call: number): number {
  return (40 + call * 7.3) % 360;
}

function visibilityRequests(call: number): VisibilityRequest[] {
  return telescopes.map((t) =>
    visibilityRequestSchema.parse({
      site: { name: t.site.name, latitudeDeg: t.site.latitudeDeg, longitudeDeg: t.site.longitudeDeg, heightM: t.site.heightM, timeZone: t.site.timeZone },
      telescope: { minAltitudeDeg: t.minAltitudeDeg, maxAirmass: t.maxAirmass, sunAvoidanceDeg: t.sunAvoidanceDeg, hourAngleHours: { min: t.hourAngleMinH, max: t.hourAngleMaxH } },
      target: { kind: "fixed", ra: raFor(call), dec: -20 },
      constraints: { darkness: "nautical", maxAirmass: 2 },
      when: { from: FROM, to: "2027-03-12" },
    }),
  );
}

function previewInput(call: number, moving: boolean, edit = 0) {
  const ra = raFor(call);
  const target = moving
    ? {
        kind: "ephemeris" as const,
        hMag: "18.5",
        ephemeris: Array.from({ length: 24 * 5 }, (_, i) => ({
          time: new Date(NOW.getTime() - 12 * HOUR + i * HOUR).toISOString(),
          ra: (ra + 0.05 * i) % 360,
          dec: -20 + 0.02 * i,
          rAu: 1.1 + 0.001 * i,
          deltaAu: 0.2 + 0.002 * i,
        })),
      }
    : { kind: "fixed" as const, ra, dec: -20 };
  return feasibilityInputSchema.parse({
    target,
    telescopeIds: ["00000000-0000-4000-8000-000000000001", "00000000-0000-4000-8000-000000000002", "00000000-0000-4000-8000-000000000003"],
    instrumentId: "00000000-0000-4000-8000-000000000002",
    durationMinutes: 60 + (edit % 5) * 10,
    earliestStart: NOW.toISOString(),
    latestEnd: new Date(NOW.getTime() + 72 * HOUR).toISOString(),
    deadline: new Date(NOW.getTime() + (72 - (edit % 7)) * HOUR).toISOString(),
    constraints: { darkness: "nautical", maxAirmass: 2 },
  });
}

const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

async function concurrent(label: string, prepare: (call: number) => () => unknown): Promise<void> {
  // Warm up the JIT and the engine's tables first.
  for (let i = 0; i < 10; i++) prepare(1000 + i)();
  const single: number[] = [];
  for (let i = 0; i < 40; i++) {
    const work = prepare(2000 + i);
    const t = performance.now();
    work();
    single.push(performance.now() - t);
  }
  single.sort((a, b) => a - b);

  const latencies: number[] = [];
  let call = 0;
  const started = performance.now();
  await Promise.all(
    Array.from({ length: CALLERS }, async () => {
      for (let r = 0; r < ROUNDS; r++) {
        const work = prepare(call++);
        const issued = performance.now();
        await nextTurn(); // queue behind the other callers, as requests to one process do
        work();
        latencies.push(performance.now() - issued);
      }
    }),
  );
  const elapsed = performance.now() - started;
  latencies.sort((a, b) => a - b);
  const f = (x: number) => x.toFixed(1).padStart(7);
  console.log(
    `${label.padEnd(62)} one call p50 ${f(percentile(single, 50))} ms | ${CALLERS} callers p50 ${f(percentile(latencies, 50))} ms  p95 ${f(percentile(latencies, 95))} ms | ${(
      (latencies.length / elapsed) *
      1000
    ).toFixed(0)} answers/s`,
  );
}

console.log(`Feasibility benchmark: ${CALLERS} concurrent callers × ${ROUNDS} answers, 3 telescopes at 2 sites, 3-night window, one thread.`);
await concurrent("A. computeVisibility ×3 telescopes, 3-night range", (call) => {
  const requests = visibilityRequests(call);
  return () => requests.map((r) => computeVisibility(r));
});
await concurrent("B. form preview (windows + chart curves), fixed target", (call) => {
  const input = previewInput(call, false);
  return () => computeFeasibility(input, telescopes, instrument, NOW);
});
await concurrent("C. form preview, moving target with the fading clock", (call) => {
  const input = previewInput(call, true);
  return () => computeFeasibility(input, telescopes, instrument, NOW);
});
await concurrent("D. form preview through the cache, PIs editing time and deadline", (call) => {
  // Sixteen PIs, each with their own target, each re-asking as they edit.
  const input = previewInput(call % CALLERS, false, Math.floor(call / CALLERS));
  return () => computeFeasibility(input, telescopes, instrument, NOW, { visibility: cachedVisibility });
});
