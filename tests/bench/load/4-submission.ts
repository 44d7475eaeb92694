// POST /api/v1/too-requests: a PI's pipeline filing requests, each with its own
// Idempotency-Key (set per request by autocannon's setupRequest) so every one is filed:
// validation, the feasibility check on the sky engine, and the filing transaction.
import type autocannon from "autocannon";
import { printLoad, runLoad } from "../load";
import { base, CONNECTIONS, filingIds, idempotencyKey, requestBody, SECONDS, token, WARMUP_SECONDS, warnIfFailed } from "./shared";

const url = `${base}/api/v1/too-requests`;
const body = requestBody(await filingIds(), "Load-run transient");
const headers = { authorization: `Bearer ${token("BENCH_PI_TOKEN")}`, "content-type": "application/json" };

const probe = await fetch(url, { method: "POST", headers: { ...headers, "idempotency-key": idempotencyKey() }, body });
if (probe.status !== 201) throw new Error(`filing answered ${probe.status}: ${await probe.text()}`);

const requests: autocannon.Request[] = [
  { method: "POST", setupRequest: (request) => ({ ...request, headers: { ...request.headers, "idempotency-key": idempotencyKey() } }) },
];
const connections = Math.min(CONNECTIONS, 4);
await runLoad({ url, method: "POST", headers, body, requests, connections, duration: WARMUP_SECONDS });
const result = await runLoad({ url, method: "POST", headers, body, requests, connections, duration: SECONDS });
printLoad(`request submission, ${connections} clients, ${SECONDS} s`, result);
warnIfFailed("submission", result);
