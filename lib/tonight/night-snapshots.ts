/**
 * Night snapshots shared by every open queue page. When an alert sends the consortium to
 * one telescope's queue, hundreds of pages poll the same night every few seconds; the
 * route may reuse a snapshot for up to a second (`maxAgeMs`) instead of asking the
 * database again for each of them. A write made through this process (an approval, an
 * acknowledgement, a log) forgets the snapshots at once; a write through another app
 * instance shows up within `maxAgeMs`. Concurrent misses share one load.
 */
import type { Db } from "@/db/index";
import { processShared } from "@/lib/process-shared";
import { loadNightSnapshot, type NightSnapshot } from "./queries";

type Query = Parameters<typeof loadNightSnapshot>[1];

const MAX_ENTRIES = 64;
const state = processShared("night-snapshots", () => ({ entries: new Map<string, { at: number; snapshot: Promise<NightSnapshot> }>(), generation: 0 }));
const { entries } = state;

export async function nightSnapshot(db: Db, q: Query, maxAgeMs: number): Promise<NightSnapshot> {
  if (maxAgeMs <= 0) return loadNightSnapshot(db, q);
  const key = `${q.telescopeId}|${q.from.toISOString()}|${q.to.toISOString()}|${q.changesSince.toISOString()}|${q.changesCap}|${q.acknowledgementsLimit}`;
  const now = Date.now();
  const hit = entries.get(key);
  if (hit && now - hit.at <= maxAgeMs) return hit.snapshot;

  const startedIn = state.generation;
  const snapshot = loadNightSnapshot(db, q);
  if (entries.size >= MAX_ENTRIES) entries.delete(entries.keys().next().value ?? "");
  entries.set(key, { at: now, snapshot });
  try {
    return await snapshot;
  } catch (error) {
    if (entries.get(key)?.snapshot === snapshot) entries.delete(key);
    throw error;
  } finally {
    // A write committed while this load ran may be missing from it: do not keep it.
    if (state.generation !== startedIn && entries.get(key)?.snapshot === snapshot) entries.delete(key);
  }
}

/** After a write that changes a queue: the next poll reads the database. */
export function forgetNightSnapshots(): void {
  state.generation++;
  entries.clear();
}
