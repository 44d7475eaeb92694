// What "a night" is. A night runs from one local mean solar noon to the next, so every
// event of one dark period (and of a polar night's day) falls inside it, at any longitude.
// It is named by the local civil date (site time zone) on which it begins — "night of".
// Spans are exactly 24 h of UT long; DST changes only move the local clock labels. Windows
// never cross a night's edge: in polar night, consecutive nights' windows meet at noon.

import { dateFromDayNumber, dayNumber, timeZoneOffsetMs } from "./local-time";
import type { Site } from "./site";
import { type Instant, MS_PER_DAY } from "./time-scales";

export interface NightSpan {
  /** Local civil date on which the night begins, "YYYY-MM-DD". */
  nightOf: string;
  start: Instant;
  end: Instant;
}

/** Mean-solar-noon instant of solar day number S (days since 1970-01-01) at a longitude. */
function meanNoon(solarDay: number, longitudeDeg: number): Instant {
  return solarDay * MS_PER_DAY + MS_PER_DAY / 2 - (longitudeDeg / 360) * MS_PER_DAY;
}

/** Civil day number on which the night of solar day S begins. */
function civilDayOf(site: Site, solarDay: number): number {
  const t = meanNoon(solarDay, site.longitudeDeg);
  const offset = site.timeZone ? timeZoneOffsetMs(site.timeZone, t) : (site.longitudeDeg / 360) * MS_PER_DAY;
  return Math.floor((t + offset) / MS_PER_DAY);
}

function requireDay(date: string): number {
  const day = dayNumber(date);
  if (day === null) throw new RangeError(`"${date}" is not a calendar date (expected YYYY-MM-DD)`);
  return day;
}

/** Solar day whose night begins on the given civil day. */
function solarDayFor(site: Site, civilDay: number): number {
  let s = civilDay;
  for (let i = 0; i < 3; i++) {
    const c = civilDayOf(site, s);
    if (c === civilDay) return s;
    s += civilDay - c;
  }
  throw new RangeError(`no night begins on ${dateFromDayNumber(civilDay)} at this site (its clocks skipped that date)`);
}

export function nightSpan(site: Site, nightOf: string): NightSpan {
  const s = solarDayFor(site, requireDay(nightOf));
  return { nightOf, start: meanNoon(s, site.longitudeDeg), end: meanNoon(s + 1, site.longitudeDeg) };
}

/** The night an instant belongs to. */
export function nightOfInstant(site: Site, t: Instant): NightSpan {
  const s = Math.floor((t - meanNoon(0, site.longitudeDeg)) / MS_PER_DAY);
  return {
    nightOf: dateFromDayNumber(civilDayOf(site, s)),
    start: meanNoon(s, site.longitudeDeg),
    end: meanNoon(s + 1, site.longitudeDeg),
  };
}

/** Consecutive nights from the night of `from` through the night of `to`, inclusive. */
export function nightsBetween(site: Site, from: string, to: string): NightSpan[] {
  const first = solarDayFor(site, requireDay(from));
  const last = solarDayFor(site, requireDay(to));
  if (last < first) throw new RangeError(`"${to}" is before "${from}"`);
  return consecutiveNights(site, first, last - first + 1);
}

/** `count` consecutive nights starting with the night of `from`. */
export function nightsFrom(site: Site, from: string, count: number): NightSpan[] {
  return consecutiveNights(site, solarDayFor(site, requireDay(from)), count);
}

function consecutiveNights(site: Site, firstSolarDay: number, count: number): NightSpan[] {
  // The civil label moves with the solar day except where a zone jumps a whole date, so
  // look the zone up at both ends and per night only if they disagree.
  const shiftFirst = civilDayOf(site, firstSolarDay) - firstSolarDay;
  const shiftLast = civilDayOf(site, firstSolarDay + count - 1) - (firstSolarDay + count - 1);
  const nights: NightSpan[] = [];
  for (let i = 0; i < count; i++) {
    const s = firstSolarDay + i;
    const civil = shiftFirst === shiftLast ? s + shiftFirst : civilDayOf(site, s);
    nights.push({
      nightOf: dateFromDayNumber(civil),
      start: meanNoon(s, site.longitudeDeg),
      end: meanNoon(s + 1, site.longitudeDeg),
    });
  }
  return nights;
}
