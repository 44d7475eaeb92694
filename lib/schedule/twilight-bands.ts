/**
 * Twilight shading for the calendar: for each night at a site, the intervals in which
 * the Sun is below the horizon and below −6°, −12° and −18°. They nest, so drawing them
 * stacked with translucent colours darkens from dusk to full night. Pure: runs in the browser.
 */
import { nightsBetween } from "@/lib/sky/nights";
import type { Site } from "@/lib/sky/site";
import { nightEvents, type NightEvents } from "@/lib/sky/twilight";

export const TWILIGHT_LEVELS = ["sunset", "civil", "nautical", "astronomical"] as const;
export type TwilightLevel = (typeof TWILIGHT_LEVELS)[number];

const LEVEL_ALTITUDE: Record<TwilightLevel, number> = { sunset: -0.833, civil: -6, nautical: -12, astronomical: -18 };

export interface TwilightBand {
  level: TwilightLevel;
  nightOf: string;
  start: number;
  end: number;
}

function eventsFor(night: NightEvents, level: TwilightLevel): [number | null, number | null] {
  switch (level) {
    case "sunset":
      return [night.sunset, night.sunrise];
    case "civil":
      return [night.civilDusk, night.civilDawn];
    case "nautical":
      return [night.nauticalDusk, night.nauticalDawn];
    case "astronomical":
      return [night.astronomicalDusk, night.astronomicalDawn];
  }
}

/** The part of one night when the Sun is below a level, or null when it never is. */
function belowLevel(night: NightEvents, level: TwilightLevel): { start: number; end: number } | null {
  const [dusk, dawn] = eventsFor(night, level);
  if (dusk === null && dawn === null) {
    // No crossing: either the Sun stays below all night (polar night) or never gets there.
    return night.sunAltitudeAtMidnightDeg < LEVEL_ALTITUDE[level] ? { start: night.start, end: night.end } : null;
  }
  return { start: dusk ?? night.start, end: dawn ?? night.end };
}

/** Bands for every night whose local date lies in [fromDate, toDate] (YYYY-MM-DD). */
export function twilightBands(site: Site, fromDate: string, toDate: string): TwilightBand[] {
  const bands: TwilightBand[] = [];
  for (const span of nightsBetween(site, fromDate, toDate)) {
    const night = nightEvents(site, span.nightOf);
    for (const level of TWILIGHT_LEVELS) {
      const below = belowLevel(night, level);
      if (below) bands.push({ level, nightOf: span.nightOf, ...below });
    }
  }
  return bands;
}
