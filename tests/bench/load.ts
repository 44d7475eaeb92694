/**
 * A small wrapper over autocannon that also records every response time, so the
 * benchmarks can print exact percentiles (autocannon's own summary has no p95).
 */
import autocannon from "autocannon";
import { percentile } from "./bench-support";

export interface LoadResult {
  requests: number;
  non2xx: number;
  errors: number;
  throughputPerSecond: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
}

export async function runLoad(options: {
  url: string;
  connections: number;
  amount?: number;
  duration?: number;
  method?: "GET" | "POST";
  headers?: Record<string, string>;
  body?: string;
  /** Per-request changes (autocannon's `setupRequest`), e.g. a fresh Idempotency-Key each time. */
  requests?: autocannon.Request[];
}): Promise<LoadResult> {
  const times: number[] = [];
  let instance!: autocannon.Instance;
  const finished = new Promise<autocannon.Result>((resolve, reject) => {
    instance = autocannon({
    url: options.url,
    connections: options.connections,
    ...(options.amount ? { amount: options.amount } : { duration: options.duration ?? 10 }),
    method: options.method ?? "GET",
    headers: options.headers,
    body: options.body,
    requests: options.requests,
    timeout: 10,
    }, (error: unknown, result: autocannon.Result) => (error ? reject(error instanceof Error ? error : new Error(String(error))) : resolve(result)));
  });
  instance.on("response", (_client: unknown, _status: number, _bytes: number, responseTime: number) => times.push(responseTime));
  const result = await finished;
  times.sort((a, b) => a - b);
  return {
    requests: result.requests.total,
    non2xx: result.non2xx,
    errors: result.errors + result.timeouts,
    throughputPerSecond: Math.round((result.requests.total / (result.duration || 1)) * 10) / 10,
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    p99: percentile(times, 99),
    max: times[times.length - 1] ?? NaN,
  };
}

export function printLoad(name: string, r: LoadResult, target?: string): void {
  const ms = (v: number) => `${v.toFixed(1)} ms`;
  console.log(
    `${name.padEnd(34)} n=${r.requests} non2xx=${r.non2xx} errors=${r.errors} rps=${r.throughputPerSecond} p50=${ms(r.p50)} p95=${ms(r.p95)} p99=${ms(r.p99)} max=${ms(r.max)}${target ? `  [target ${target}]` : ""}`,
  );
}
