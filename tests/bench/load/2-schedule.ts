// GET /api/v1/schedule: one week of all telescopes' blocks, what the calendar asks for.
import { printLoad, runLoad } from "../load";
import { base, CONNECTIONS, SECONDS, token, WARMUP_SECONDS, warnIfFailed } from "./shared";

const from = new Date(Date.now() - 86_400_000).toISOString();
const to = new Date(Date.now() + 6 * 86_400_000).toISOString();
const url = `${base}/api/v1/schedule?from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}`;
const headers = { authorization: `Bearer ${token("BENCH_TOKEN")}` };

const probe = await fetch(url, { headers });
if (!probe.ok) throw new Error(`the schedule route answered ${probe.status}: ${await probe.text()}`);
const { blocks } = (await probe.json()) as { blocks: unknown[] };
console.log(`schedule: one week, all telescopes = ${blocks.length} blocks`);
await runLoad({ url, headers, connections: CONNECTIONS, duration: WARMUP_SECONDS });
const result = await runLoad({ url, headers, connections: CONNECTIONS, duration: SECONDS });
printLoad(`schedule (week), ${CONNECTIONS} clients, ${SECONDS} s`, result);
warnIfFailed("schedule", result);
