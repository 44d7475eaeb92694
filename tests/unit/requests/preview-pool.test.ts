// The live preview's worker threads: the same report as the in-process computation, each
// answer to its own caller under concurrency, and a worker that is stopped or overruns its
// time limit fails only its own previews, with a message, while the next one is answered.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { computeFeasibility } from "@/lib/requests/feasibility/compute";
import { previewReportJson, previewWorkerCount, stopPreviewWorkers } from "@/lib/requests/feasibility/preview-pool";
import type { InstrumentRef, TelescopeSky } from "@/lib/requests/feasibility/types";
import { feasibilityInputSchema } from "@/lib/requests/schemas";

const NOW = new Date("2027-03-10T15:00:00Z");
const HOUR = 3_600_000;
const south = { id: "s", code: "S", name: "Southern site", latitudeDeg: -30, longitudeDeg: -70, heightM: 2000, timeZone: "America/Santiago" };
const north = { id: "n", code: "N", name: "Northern site", latitudeDeg: 38, longitudeDeg: -4, heightM: 1800, timeZone: "Europe/Madrid" };
const scope = (id: string, site: TelescopeSky["site"]): TelescopeSky => ({
  id,
  code: id.toUpperCase(),
  name: `Scope ${id}`,
  minAltitudeDeg: 20,
  maxAirmass: 2.9,
  sunAvoidanceDeg: 40,
  hourAngleMinH: -6,
  hourAngleMaxH: 6,
  site,
});
const telescopes = [scope("a", south), scope("b", south), scope("c", north)];
const camera: InstrumentRef = { id: "i", telescopeId: "a", code: "CAM", name: "Camera", limitingMagnitude: 21 };

function input(raDeg: number) {
  return feasibilityInputSchema.parse({
    target: { kind: "fixed", ra: raDeg.toFixed(3), dec: "-25" },
    telescopeIds: ["00000000-0000-4000-8000-000000000001"],
    durationMinutes: "60",
    earliestStart: NOW.toISOString(),
    latestEnd: new Date(NOW.getTime() + 72 * HOUR).toISOString(),
    deadline: new Date(NOW.getTime() + 72 * HOUR).toISOString(),
    constraints: { darkness: "nautical", maxAirmass: "2.5" },
  });
}

const inProcess = (raDeg: number) => JSON.parse(JSON.stringify(computeFeasibility(input(raDeg), telescopes, camera, NOW)));
const onWorker = async (raDeg: number, limitMs?: number) => JSON.parse(await previewReportJson(input(raDeg), telescopes, camera, NOW, limitMs));

describe("the preview's worker pool", () => {
  const before = process.env.FEASIBILITY_WORKERS;
  beforeAll(() => {
    process.env.FEASIBILITY_WORKERS = "2";
  });
  afterAll(async () => {
    process.env.FEASIBILITY_WORKERS = before;
    await stopPreviewWorkers();
  });

  it("answers the same report as the computation on the calling thread", async () => {
    expect(previewWorkerCount()).toBe(2);
    const report = await onWorker(120);
    expect(report.telescopes).toHaveLength(3);
    expect(report).toEqual(inProcess(120));
  }, 60_000);

  it("gives each of many concurrent callers its own answer", async () => {
    const targets = Array.from({ length: 12 }, (_, i) => (i * 29.5) % 360);
    const answers = await Promise.all(targets.map((ra) => onWorker(ra)));
    answers.forEach((report, i) => expect(report).toEqual(inProcess(targets[i]!)));
    // Different targets really do give different reports, so a mix-up would show.
    expect(new Set(answers.map((a) => JSON.stringify(a.telescopes))).size).toBeGreaterThan(6);
  }, 60_000);

  it("fails a preview that overruns its time limit, and answers the next one on a new worker", async () => {
    await stopPreviewWorkers(); // a fresh worker spends far longer than 1 ms loading the engine
    await expect(onWorker(200, 1)).rejects.toThrow(/took longer than 1 ms; its worker was restarted/);
    expect(await onWorker(200)).toEqual(inProcess(200));
  }, 60_000);

  it("fails the previews waiting on stopped workers with a message, and starts new ones", async () => {
    const settled = Promise.allSettled([onWorker(10), onWorker(20), onWorker(30)]);
    await stopPreviewWorkers();
    for (const s of await settled) expect(s.status === "rejected" && String(s.reason)).toMatch(/The feasibility worker stopped/);
    expect(await onWorker(30)).toEqual(inProcess(30));
  }, 60_000);

  it("passes an error in the computation back to its caller and keeps serving", async () => {
    const broken = [{ ...telescopes[0]!, site: { ...south, timeZone: "Not/AZone" } }];
    await expect(previewReportJson(input(50), broken, null, NOW)).rejects.toThrow(/time ?zone/i);
    expect(await onWorker(50)).toEqual(inProcess(50));
  }, 60_000);
});
