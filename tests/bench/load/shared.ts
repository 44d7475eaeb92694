/**
 * What the load scripts share: the app's address (loopback only), the tokens made by
 * scripts/bench-load.sh, the bounds of a run, and a body for filing a request that the
 * sky allows whatever the date (a target opposite the Sun, at the southern site's zenith).
 */
import { randomUUID } from "node:crypto";
import { createDb } from "../../../db/index";
import { formatRa } from "../../../lib/sky/coordinates";
import { sunPosition } from "../../../lib/sky/sun";
import type { LoadResult } from "../load";

export const base = process.env.BENCH_BASE_URL ?? "";
if (!base) throw new Error("run through `npm run bench:load` (needs BENCH_BASE_URL and the bench tokens)");
if (!["127.0.0.1", "localhost", "[::1]"].includes(new URL(base).hostname)) throw new Error(`load runs stay on loopback, not ${base}`);

export function token(name: "BENCH_TOKEN" | "BENCH_PI_TOKEN" | "BENCH_DIRECTOR_TOKEN"): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run through \`npm run bench:load\``);
  return value;
}

/** Seconds per measured run, after a short warm-up. */
export const SECONDS = Number(process.env.BENCH_LOAD_SECONDS ?? 8);
export const WARMUP_SECONDS = 2;
export const CONNECTIONS = Number(process.env.BENCH_LOAD_CONNECTIONS ?? 10);

const HOUR = 3_600_000;

export async function filingIds(): Promise<{ programId: string; telescopeId: string; instrumentId: string }> {
  const db = createDb(process.env.DATABASE_URL ?? "", 1);
  try {
    const program = await db.selectFrom("programs").select("id").where("code", "=", "TOO-01").executeTakeFirstOrThrow();
    const telescope = await db.selectFrom("telescopes").select("id").where("code", "=", "AQ16").executeTakeFirstOrThrow();
    const instrument = await db.selectFrom("instruments").select("id").where("code", "=", "PICO").executeTakeFirstOrThrow();
    return { programId: program.id, telescopeId: telescope.id, instrumentId: instrument.id };
  } finally {
    await db.destroy();
  }
}

export function requestBody(ids: { programId: string; telescopeId: string; instrumentId: string }, name: string): string {
  const now = Date.now();
  const ra = (sunPosition(now).raDeg + 180) % 360;
  return JSON.stringify({
    programId: ids.programId,
    targetName: name,
    target: { kind: "fixed", ra: formatRa(ra, { style: "spaces", decimals: 1 }), dec: "-30 00 00" },
    telescopeIds: [ids.telescopeId],
    instrumentId: ids.instrumentId,
    durationMinutes: 60,
    earliestStart: new Date(now).toISOString(),
    latestEnd: new Date(now + 72 * HOUR).toISOString(),
    deadline: new Date(now + 72 * HOUR).toISOString(),
    urgency: "within_days",
    constraints: { darkness: "nautical", maxAirmass: 2.5 },
    justification: "Load run: photometry of an invented fast-fading transient before it fades below reach.",
  });
}

export const idempotencyKey = () => `bench-${randomUUID()}`;

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
}

/** The same figures as runLoad, from response times measured by a custom loop. */
export function summarize(times: number[], failures: number, seconds: number): LoadResult {
  const sorted = [...times].sort((a, b) => a - b);
  return {
    requests: times.length,
    non2xx: failures,
    errors: 0,
    throughputPerSecond: Math.round((times.length / (seconds || 1)) * 10) / 10,
    p50: percentile(sorted, 50),
    p95: percentile(sorted, 95),
    p99: percentile(sorted, 99),
    max: sorted.at(-1) ?? NaN,
  };
}

export function warnIfFailed(name: string, r: LoadResult): void {
  if (r.non2xx > 0 || r.errors > 0) console.log(`${name}: ${r.non2xx} non-2xx answers and ${r.errors} errors during the run — the figures above include them`);
}
