/**
 * A small in-process cache of schedule answers, keyed by a fingerprint of the blocks
 * table. Any insert, update or delete changes the fingerprint (row count, newest
 * created_at, newest updated_at — every write path sets one of them), so a cached answer
 * is never served after the schedule changed. Each app instance keeps its own. (Every
 * write sets created_at or updated_at from the clock; instances whose clocks disagree by
 * more than the time between two edits could miss one — run them with NTP, as usual.)
 */
import { sql } from "kysely";
import type { Db } from "@/db/index";

const MAX_ENTRIES = 64;
const cache = new Map<string, string>();

export async function scheduleFingerprint(db: Db): Promise<string> {
  const { rows } = await sql<{ n: string; created: Date | null; updated: Date | null }>`
    select count(*) as n, max(created_at) as created, max(updated_at) as updated from blocks`.execute(db);
  const row = rows[0];
  return `${row?.n ?? 0}|${row?.created?.getTime() ?? 0}|${row?.updated?.getTime() ?? 0}`;
}

/** The cached body for this key and fingerprint, or a fresh one from `build`. */
export async function cachedSchedule(db: Db, key: string, build: () => Promise<string>): Promise<string> {
  const fullKey = `${await scheduleFingerprint(db)}#${key}`;
  const hit = cache.get(fullKey);
  if (hit !== undefined) return hit;
  const body = await build();
  if (cache.size >= MAX_ENTRIES) cache.delete(cache.keys().next().value ?? "");
  cache.set(fullKey, body);
  return body;
}
