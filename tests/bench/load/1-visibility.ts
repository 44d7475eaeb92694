// POST /api/v1/visibility: one night of windows and curves for a fixed target from the
// southern site — pure computation (the sky engine) behind authentication.
import { printLoad, runLoad } from "../load";
import { base, CONNECTIONS, SECONDS, token, WARMUP_SECONDS, warnIfFailed } from "./shared";

const url = `${base}/api/v1/visibility`;
const headers = { authorization: `Bearer ${token("BENCH_TOKEN")}`, "content-type": "application/json" };
const body = JSON.stringify({
  site: { name: "Alto Quebrada Station", latitudeDeg: -30.52, longitudeDeg: -70.41, heightM: 2310, timeZone: "America/Santiago" },
  telescope: { minAltitudeDeg: 25, sunAvoidanceDeg: 45, hourAngleHours: { min: -5, max: 5 } },
  target: { kind: "fixed", name: "load field", ra: "05h35m17.3s", dec: "-05 23 28" },
  constraints: { darkness: "nautical", maxAirmass: 2.4, minMoonSeparationDeg: 30 },
  when: { night: new Date().toISOString().slice(0, 10) },
});

const probe = await fetch(url, { method: "POST", headers, body });
if (!probe.ok) throw new Error(`the visibility route answered ${probe.status}: ${await probe.text()}`);
await runLoad({ url, method: "POST", headers, body, connections: CONNECTIONS, duration: WARMUP_SECONDS });
const result = await runLoad({ url, method: "POST", headers, body, connections: CONNECTIONS, duration: SECONDS });
printLoad(`visibility, ${CONNECTIONS} clients, ${SECONDS} s`, result);
warnIfFailed("visibility", result);
