// GET /api/v1/telescopes/AQ41/queue: tonight's queue, which every open queue page polls.
import { printLoad, runLoad } from "../load";
import { base, CONNECTIONS, SECONDS, token, WARMUP_SECONDS, warnIfFailed } from "./shared";

const url = `${base}/api/v1/telescopes/AQ41/queue`;
const headers = { authorization: `Bearer ${token("BENCH_TOKEN")}` };

const probe = await fetch(url, { headers });
if (!probe.ok) throw new Error(`the queue route answered ${probe.status}: ${await probe.text()}`);
await runLoad({ url, headers, connections: CONNECTIONS, duration: WARMUP_SECONDS });
const result = await runLoad({ url, headers, connections: CONNECTIONS, duration: SECONDS });
printLoad(`tonight's queue (AQ41), ${CONNECTIONS} clients, ${SECONDS} s`, result);
warnIfFailed("queue", result);
