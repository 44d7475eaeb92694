/**
 * A small in-process cache of schedule answers, keyed by a fingerprint of the blocks
 * table. Any insert, update or delete changes the fingerprint (row count, newest
 * created_at, newest updated_at — every write path sets one of them), so a cached answer
 * is not served after the schedule changed (see FINGERPRINT_REUSE_MS). Each app instance
 * keeps its own. (Every
 * write sets created_at or updated_at from the clock; instances whose clocks disagree by
 * more than the time between two edits could miss one — run them with NTP, as usual.)
 */
import { sql } from "kysely";
import type { Db } from "@/db/index";
import { processShared } from "@/lib/process-shared";

/** One answer, encoded to UTF-8 once (a semester is ~680 KB of JSON). */
export interface CachedAnswer {
  bytes: Buffer;
}

const MAX_ENTRIES = 64;
const state = processShared("schedule-answers", () => ({
  answers: new Map<string, CachedAnswer>(),
  checked: null as { at: number; fingerprint: string } | null,
  generation: 0,
}));
const cache = state.answers;

function answerOf(body: string): CachedAnswer {
  return { bytes: Buffer.from(body, "utf8") };
}

export async function scheduleFingerprint(db: Db): Promise<string> {
  const { rows } = await sql<{ n: string; created: Date | null; updated: Date | null }>`
    select count(*) as n, max(created_at) as created, max(updated_at) as updated from blocks`.execute(db);
  const row = rows[0];
  return `${row?.n ?? 0}|${row?.created?.getTime() ?? 0}|${row?.updated?.getTime() ?? 0}`;
}

// The fingerprint itself is asked for at most once a second: a write through this process
// forgets it at once (scheduleChanged in after-write.ts); one through another app instance
// shows within FINGERPRINT_REUSE_MS (the calendar refreshes every 30 s in any case).
export const FINGERPRINT_REUSE_MS = 1000;

async function currentFingerprint(db: Db): Promise<string> {
  const now = Date.now();
  const { checked } = state;
  if (checked && now - checked.at <= FINGERPRINT_REUSE_MS) return checked.fingerprint;
  const startedIn = state.generation;
  const fingerprint = await scheduleFingerprint(db);
  if (state.generation === startedIn) state.checked = { at: now, fingerprint };
  return fingerprint;
}

/** After a write to the blocks: the next answer asks the database. */
export function forgetScheduleFingerprint(): void {
  state.generation++;
  state.checked = null;
}

/** The cached answer for this key and fingerprint, or a fresh one from `build`. */
export async function cachedSchedule(db: Db, key: string, build: () => Promise<string>): Promise<CachedAnswer> {
  const fullKey = `${await currentFingerprint(db)}#${key}`;
  const hit = cache.get(fullKey);
  if (hit !== undefined) return hit;
  const answer = answerOf(await build());
  if (cache.size >= MAX_ENTRIES) cache.delete(cache.keys().next().value ?? "");
  cache.set(fullKey, answer);
  return answer;
}

/**
 * The answer as a response. (Compression is the load balancer's: a route handler cannot
 * hand Next a body it already gzipped — Next drops the content-encoding header.)
 */
export function answerResponse(answer: CachedAnswer, headers: Record<string, string>): Response {
  // A Buffer is a Uint8Array over an ArrayBuffer (never a SharedArrayBuffer here).
  return new Response(answer.bytes as Uint8Array<ArrayBuffer>, { headers });
}
