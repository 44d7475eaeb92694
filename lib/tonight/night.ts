/**
 * The night a queue covers: the sky engine's noon-to-noon span named by the local date on
 * which it begins, its sunset, twilight and sunrise, and the twilight bands to draw.
 * Pure and memoised: a night's Sun does not change between two polls of the queue.
 */
import { type Instant, nightEvents, nightOfInstant, nightSpan, type Site } from "@/lib/sky";
import { twilightBands } from "@/lib/schedule/twilight-bands";
import type { QueueNight } from "./types";

export class NightNotAtSiteError extends Error {}

const iso = (t: Instant | null) => (t === null ? null : new Date(t).toISOString());

const MAX_CACHED = 256;
const cache = new Map<string, QueueNight>();

function compute(site: Site, nightOf: string): QueueNight {
  const events = nightEvents(site, nightOf);
  return {
    nightOf,
    start: new Date(events.start).toISOString(),
    end: new Date(events.end).toISOString(),
    sunset: iso(events.sunset),
    civilDusk: iso(events.civilDusk),
    nauticalDusk: iso(events.nauticalDusk),
    astronomicalDusk: iso(events.astronomicalDusk),
    astronomicalDawn: iso(events.astronomicalDawn),
    nauticalDawn: iso(events.nauticalDawn),
    civilDawn: iso(events.civilDawn),
    sunrise: iso(events.sunrise),
    bands: twilightBands(site, nightOf, nightOf).map((b) => ({ level: b.level, start: new Date(b.start).toISOString(), end: new Date(b.end).toISOString() })),
  };
}

/** The night of a local date at a site (throws NightNotAtSiteError for a date its clocks skipped). */
export function nightAt(site: Site, nightOf: string): QueueNight {
  const key = `${site.latitudeDeg}|${site.longitudeDeg}|${site.heightM}|${site.timeZone ?? ""}|${nightOf}`;
  const hit = cache.get(key);
  if (hit) return hit;
  let night: QueueNight;
  try {
    nightSpan(site, nightOf);
    night = compute(site, nightOf);
  } catch (error) {
    if (error instanceof RangeError) throw new NightNotAtSiteError(error.message);
    throw error;
  }
  if (cache.size >= MAX_CACHED) cache.delete(cache.keys().next().value ?? "");
  cache.set(key, night);
  return night;
}

/** "Tonight" at a site: the night the instant belongs to (until local noon, last night). */
export function tonightOf(site: Site, now: Date): string {
  return nightOfInstant(site, now.getTime()).nightOf;
}
