// POST /api/v1/too-requests/{id}/decision: N requests are filed first (not measured), then
// each is approved once, by a few directors' clients at a time: one-hour slots at 04:00 UT
// (night at the southern site) on AQ16, one night apart, so every approval splices a
// different observing block. (Approvals running at once that cut the same block can answer
// 409 slot_taken though their slots do not overlap; this run measures the splice, not that.)
// Every approval is a different URL and body, so this is a small closed loop of timed
// fetches rather than autocannon.
import { printLoad } from "../load";
import { base, CONNECTIONS, filingIds, idempotencyKey, requestBody, SECONDS, summarize, token, warnIfFailed } from "./shared";

const HOUR = 3_600_000;
const N = Number(process.env.BENCH_APPROVALS ?? 100);
const connections = Math.min(CONNECTIONS, 4);
const ids = await filingIds();
const piHeaders = { authorization: `Bearer ${token("BENCH_PI_TOKEN")}`, "content-type": "application/json" };
const directorHeaders = { authorization: `Bearer ${token("BENCH_DIRECTOR_TOKEN")}`, "content-type": "application/json" };

async function pool<T>(items: T[], workers: number, work: (item: T, index: number) => Promise<void>, deadline = Infinity): Promise<void> {
  let next = 0;
  await Promise.all(
    Array.from({ length: workers }, async () => {
      while (next < items.length && performance.now() < deadline) {
        const index = next++;
        await work(items[index]!, index);
      }
    }),
  );
}

const filed: string[] = [];
const body = requestBody(ids, "Load-run approval");
await pool(Array.from({ length: N }), 4, async () => {
  const response = await fetch(`${base}/api/v1/too-requests`, { method: "POST", headers: { ...piHeaders, "idempotency-key": idempotencyKey() }, body });
  if (response.status !== 201) throw new Error(`filing answered ${response.status}: ${await response.text()}`);
  filed.push(((await response.json()) as { request: { id: string } }).request.id);
});
console.log(`approval: filed ${filed.length} requests to approve`);

// The first slot is tomorrow's 04:00 UT or later, so none is in the past or in progress.
const DAY = 24 * HOUR;
const first = Math.ceil((Date.now() + DAY - 4 * HOUR) / DAY) * DAY + 4 * HOUR;
const times: number[] = [];
let failures = 0;
const started = performance.now();
await pool(
  filed,
  connections,
  async (id, i) => {
    const start = first + i * DAY;
    const decision = JSON.stringify({ decision: "approve", telescopeId: ids.telescopeId, start: new Date(start).toISOString(), end: new Date(start + HOUR).toISOString(), note: "load run" });
    const t0 = performance.now();
    const response = await fetch(`${base}/api/v1/too-requests/${id}/decision`, { method: "POST", headers: directorHeaders, body: decision });
    const text = await response.text();
    times.push(performance.now() - t0);
    if (!response.ok) {
      failures++;
      if (failures === 1) console.log(`approval: first failure ${response.status} ${text.slice(0, 300)}`);
    }
  },
  started + SECONDS * 1000,
);
const result = summarize(times, failures, (performance.now() - started) / 1000);
printLoad(`approval, ${connections} clients, ${times.length} of ${N}`, result);
warnIfFailed("approval", result);
