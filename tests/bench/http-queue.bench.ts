/**
 * Tonight's queue under load, against the production build started by scripts/bench.sh:
 * GET /api/v1/telescopes/AQ41/queue (the route every open queue page polls every 5 s)
 * for about ten seconds from enough clients to show the target of 300 requests per
 * second with a 95th percentile under 50 ms. The requests take turns between four
 * viewers (night assistant, director, observer, admin), so each answer is composed for
 * its viewer from the shared night snapshot as it would be for many open pages.
 */
import { printLoad, runLoad } from "./load";
import { makeBenchTokens, QUEUE_VIEWERS, rotatingViewers } from "./tokens";

const base = process.env.BENCH_BASE_URL;
const token = process.env.BENCH_TOKEN;
if (!base || !token) throw new Error("run through `npm run bench` (needs BENCH_BASE_URL and BENCH_TOKEN)");

const url = `${base}/api/v1/telescopes/AQ41/queue`;
const headers = { authorization: `Bearer ${token}` };

const probe = await fetch(url, { headers });
if (!probe.ok) throw new Error(`the queue route answered ${probe.status}: ${await probe.text()}`);
const body = (await probe.json()) as { night: { nightOf: string }; blocks: unknown[]; changes: { items: unknown[] } };
console.log(`queue API: AQ41, night of ${body.night.nightOf} = ${body.blocks.length} blocks, ${body.changes.items.length} unacknowledged changes, ${JSON.stringify(body).length} bytes`);

const requests = rotatingViewers(await makeBenchTokens(QUEUE_VIEWERS));
await runLoad({ url, connections: 8, duration: 3, requests }); // warm-up: JIT, pool, the night's sky cache
// A closed loop: latency ≈ connections / throughput once the server is busy, so just enough
// clients to ask for well over 300 rps at the target latency, and no more.
const connections = Number(process.env.BENCH_QUEUE_CONNECTIONS ?? 10);
const result = await runLoad({ url, connections, duration: 10, requests });
printLoad(`queue API, ${connections} clients (4 viewers), 10 s`, result, "≥ 300 rps, p95 < 50 ms");
if (result.non2xx > 0 || result.errors > 0) console.log(`queue API: ${result.non2xx} non-2xx answers and ${result.errors} errors during the run`);
console.log(`queue API: ${result.throughputPerSecond >= 300 && result.p95 < 50 ? "meets" : "misses"} the target (${result.throughputPerSecond} rps, p95 ${result.p95.toFixed(1)} ms)`);
