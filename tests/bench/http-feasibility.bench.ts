/**
 * The request form's live preview under load, against the production build started by
 * scripts/bench.sh: POST /api/v1/too-requests/feasibility for the demo's three telescopes
 * (two sites) over a 3-night window, from 16 concurrent clients. Every request asks about
 * a different target, so no answer comes from the preview's cache of nights: this is the
 * cost of PIs all typing new coordinates at once. Target: p95 under 150 ms.
 * Then, for information (no target), the same with a moving target: an hourly ephemeris
 * with r and Δ over the window, and the fading clock against the instrument's limit.
 */
import { randomInt } from "node:crypto";
import type autocannon from "autocannon";
import { createDb } from "../../db/index";
import { printLoad, runLoad } from "./load";

const base = process.env.BENCH_BASE_URL;
const token = process.env.BENCH_TOKEN;
if (!base || !token) throw new Error("run through `npm run bench` (needs BENCH_BASE_URL and BENCH_TOKEN)");

const db = createDb(process.env.DATABASE_URL ?? "", 1);
const telescopes = await db.selectFrom("telescopes").select(["id", "code"]).where("code", "in", ["AQ41", "AQ16", "SO25"]).execute();
const instrument = await db.selectFrom("instruments").select("id").where("telescope_id", "=", telescopes[0]!.id).executeTakeFirst();
await db.destroy();

const HOUR = 3_600_000;
const now = Date.now();
function ephemeris(raDeg: number) {
  // Hourly rows from 12 h before now to 12 h after the deadline, moving 0.05°/h.
  return Array.from({ length: 96 }, (_, i) => ({
    time: new Date(now + (i - 12) * HOUR).toISOString(),
    ra: ((raDeg + 0.05 * i) % 360).toFixed(4),
    dec: (-25 + 0.02 * i).toFixed(4),
    rAu: 1.2 + 0.001 * i,
    deltaAu: 0.3 + 0.002 * i,
  }));
}

function body(raDeg: number, moving = false): string {
  return JSON.stringify({
    target: moving ? { kind: "ephemeris", hMag: "17.5", ephemeris: ephemeris(raDeg) } : { kind: "fixed", ra: raDeg.toFixed(4), dec: "-25" },
    telescopeIds: telescopes.map((t) => t.id),
    instrumentId: instrument?.id,
    durationMinutes: 90,
    earliestStart: new Date(now).toISOString(),
    latestEnd: new Date(now + 72 * HOUR).toISOString(),
    deadline: new Date(now + 72 * HOUR).toISOString(),
    constraints: { darkness: "nautical", maxAirmass: 2 },
  });
}

const url = `${base}/api/v1/too-requests/feasibility`;
const headers = { authorization: `Bearer ${token}`, "content-type": "application/json" };
const probe = await fetch(url, { method: "POST", headers, body: body(83.8) });
if (!probe.ok) throw new Error(`the preview answered ${probe.status}: ${await probe.text()}`);
const answer = await probe.text();
console.log(`feasibility preview: ${telescopes.map((t) => t.code).join(", ")}, 3 nights, ${answer.length} bytes per answer`);

// A new target for every request (RA to 1/10000 degree): nothing is answered from a cache.
const requests: autocannon.Request[] = [{ setupRequest: (request: autocannon.Request) => ({ ...request, body: body(randomInt(0, 3_600_000) / 10_000) }) }];
await runLoad({ url, method: "POST", headers, connections: 16, duration: 3, requests }); // warm-up
const result = await runLoad({ url, method: "POST", headers, connections: 16, duration: 10, requests });
printLoad("feasibility preview, 16 clients, a new target each time", result, "p95 < 150 ms");
if (result.non2xx > 0 || result.errors > 0) console.log(`feasibility preview: ${result.non2xx} non-2xx answers and ${result.errors} errors during the run`);

const movingProbe = await fetch(url, { method: "POST", headers, body: body(83.8, true) });
if (!movingProbe.ok) throw new Error(`the preview answered ${movingProbe.status} for a moving target: ${await movingProbe.text()}`);
const moving: autocannon.Request[] = [{ setupRequest: (request: autocannon.Request) => ({ ...request, body: body(randomInt(0, 3_600_000) / 10_000, true) }) }];
const movingResult = await runLoad({ url, method: "POST", headers, connections: 16, duration: 10, requests: moving });
printLoad("feasibility preview, moving target (96-row ephemeris), 16 clients, no target", movingResult);
