// A moving target that fades past the instrument's limit, from filing to the director's
// desk: filing refuses it when only windows after the fade are long enough; filed with a
// window before the fade, the stored check, the queue's "next window" and the slot finder
// all stop at the fade.
import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { computeFeasibility } from "@/lib/requests/feasibility/compute";
import { RequestRefusedError } from "@/lib/requests/errors";
import { findRequestById } from "@/lib/requests/queries";
import { listTelescopesForSky } from "@/lib/requests/reference-queries";
import { feasibilityInputSchema, type RequestFormValues, requestSchema } from "@/lib/requests/schemas";
import { fileRequest } from "@/lib/requests/service";
import { listReviewQueue } from "@/lib/review/queue";
import { sunPosition } from "@/lib/sky";
import { findSlotsForRequest } from "@/lib/slot-finder/service";
import { formatUt } from "@/lib/time/format";
import { makeRequestWorld, requestBody, type RequestWorld } from "./fixtures";

// A fixed "now" keeps the sky the same on every run: 15:00 UT is late morning in Chile.
const NOW = new Date("2027-03-10T15:00:00Z");
const HOUR = 3_600_000;
const sun = sunPosition(NOW.getTime());

afterAll(async () => {
  await closeNoticeQueue();
});

/** Opposite the Sun, its own magnitudes crossing the fixture camera's limit (V 21) at `fadeAt`. */
function fadingTarget(fadeAt: number): RequestFormValues["target"] {
  const ephemeris = Array.from({ length: 97 }, (_, i) => {
    const time = NOW.getTime() - 12 * HOUR + i * HOUR;
    return { time: new Date(time).toISOString(), ra: ((sun.raDeg + 180) % 360) + i * 0.05, dec: -30 + i * 0.02, magnitude: 21 + ((time - fadeAt) / HOUR) * 0.1 };
  });
  return { kind: "ephemeris", ephemeris };
}

function body(world: RequestWorld, fadeAt: number) {
  return requestSchema.parse({ ...requestBody(world, NOW, { ra: "", dec: "" }), targetName: "Fading fixture", target: fadingTarget(fadeAt) });
}

/** Tonight's first window for the target, without the fading clock. */
async function firstWindow(world: RequestWorld): Promise<{ start: number; end: number }> {
  const input = feasibilityInputSchema.parse({ ...requestBody(world, NOW, { ra: "", dec: "" }), target: fadingTarget(NOW.getTime()) });
  const report = computeFeasibility(input, await listTelescopesForSky(getDb(), [world.telescopeId]), null, NOW);
  const w = report.telescopes[0]!.nights.flatMap((n) => n.windows)[0]!;
  return { start: Date.parse(w.start), end: Date.parse(w.end) };
}

describe("the fading clock from filing to the director's desk", () => {
  it("refuses to file when the only windows long enough come after the fade, naming the fade time", async () => {
    const world = await makeRequestWorld();
    const tonight = await firstWindow(world);
    const refusal = await fileRequest(getDb(), { id: world.piId, roles: ["pi"] }, body(world, tonight.start + 30 * 60_000), { source: "api", now: NOW }).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(RequestRefusedError);
    const { report } = refusal as RequestRefusedError;
    const when = formatUt(new Date(Date.parse(report.horizon.end)));
    expect(report.reasons).toEqual([
      `No observable window of 60 min before the target fades past CAM's limit V 21.0 at ${when} UT on any acceptable telescope.`,
      `The longest observable window on ${world.telescopeCode} before the target fades past CAM's limit V 21.0 at ${when} UT is 30 min; the request needs 60 min.`,
    ]);
  });

  it("files a window before the fade, and offers the director nothing after it", async () => {
    const world = await makeRequestWorld();
    const db = getDb();
    const tonight = await firstWindow(world);
    const fadeAt = tonight.start + 3 * HOUR;
    const filed = await fileRequest(db, { id: world.piId, roles: ["pi"] }, body(world, fadeAt), { source: "api", now: NOW });
    const fade = Date.parse(filed.report.horizon.end);
    expect(Math.abs(fade - fadeAt)).toBeLessThan(2000);

    const request = (await findRequestById(db, filed.id))!;
    const stored = request.feasibility!.telescopes.flatMap((t) => t.nights.flatMap((n) => n.windows));
    expect(stored.length).toBeGreaterThan(0);
    for (const w of stored) expect(Date.parse(w.end)).toBeLessThanOrEqual(fade);

    // The director's queue and home: the next window is tonight's, and none is left once it has faded.
    const queued = async (now: number) => (await listReviewQueue(db, new Date(now))).find((q) => q.id === filed.id)!;
    expect((await queued(NOW.getTime())).nextWindow?.start).toBe(tonight.start);
    expect((await queued(fade - 30 * 60_000)).nextWindow).toBeNull();

    const slots = await findSlotsForRequest(db, request, NOW);
    expect(slots.suggestions.length).toBeGreaterThan(0);
    for (const s of slots.suggestions) expect(s.end).toBeLessThanOrEqual(fade);
    expect(slots.usable.end).toBe(fade);
    expect(slots.note).toBe(`No slot is offered after ${formatUt(new Date(fade))} UT, when the target fades past CAM's limit V 21.0: later slots cannot reach it.`);
  });
});
