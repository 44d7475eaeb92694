/**
 * Wall-clock times at a site ↔ UTC instants, with Intl doing the IANA zone work (DST
 * included), so no time-zone package is needed. A local time that does not exist (the hour
 * skipped when clocks go forward) or exists twice (clocks go back) is refused rather than
 * guessed: a block an hour off is worse than a row to fix.
 */

export interface WallClock {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

const formats = new Map<string, Intl.DateTimeFormat>();

function zoneFormat(timeZone: string): Intl.DateTimeFormat {
  let fmt = formats.get(timeZone);
  if (!fmt) {
    fmt = new Intl.DateTimeFormat("en-US", {
      timeZone,
      year: "numeric",
      month: "numeric",
      day: "numeric",
      hour: "numeric",
      minute: "numeric",
      second: "numeric",
      hourCycle: "h23",
      era: "short",
    });
    formats.set(timeZone, fmt);
  }
  return fmt;
}

/** True for names Intl knows ("Europe/Madrid", "UTC"); false for "Mars/Olympus" or "". */
export function isKnownTimeZone(timeZone: string): boolean {
  if (!timeZone.trim()) return false;
  try {
    zoneFormat(timeZone);
    return true;
  } catch {
    return false;
  }
}

/** The wall clock shown at `timeZone` at an instant (whole seconds). */
export function wallClockAt(instant: Date, timeZone: string): WallClock {
  const parts: Record<string, string> = {};
  for (const p of zoneFormat(timeZone).formatToParts(instant)) parts[p.type] = p.value;
  const year = Number(parts.year);
  return {
    year: parts.era === "BC" ? 1 - year : year,
    month: Number(parts.month),
    day: Number(parts.day),
    hour: Number(parts.hour),
    minute: Number(parts.minute),
    second: Number(parts.second),
  };
}

function wallClockMs(w: WallClock): number {
  const d = new Date(0);
  d.setUTCFullYear(w.year, w.month - 1, w.day);
  d.setUTCHours(w.hour, w.minute, w.second, 0);
  return d.getTime();
}

/** Local time minus UT at an instant, in minutes (Madrid in summer: +120). */
export function utcOffsetMinutes(instant: Date, timeZone: string): number {
  const whole = Math.floor(instant.getTime() / 1000) * 1000;
  return Math.round((wallClockMs(wallClockAt(new Date(whole), timeZone)) - whole) / 60_000);
}

/** True when the fields name a real calendar moment (no 31 April, no 24:00). */
export function isValidWallClock(w: WallClock): boolean {
  if (w.month < 1 || w.month > 12 || w.day < 1 || w.hour > 23 || w.minute > 59 || w.second > 59) return false;
  const d = new Date(wallClockMs(w));
  return d.getUTCMonth() === w.month - 1 && d.getUTCDate() === w.day;
}

export type ZonedResult =
  | { ok: true; instant: Date }
  | { ok: false; reason: "nonexistent" }
  /** `offsets`: the zone's two offsets that night, in minutes, earlier instant first. */
  | { ok: false; reason: "ambiguous"; offsets: number[] };

const DAY_MS = 86_400_000;

/**
 * The UTC instant at which the wall clock at `timeZone` reads `w`. Zone offsets are
 * sampled a day either side: equal offsets mean no change near this time (real DST rules
 * put changes months apart); different ones mean we try both and see which read back.
 */
export function zonedToUtc(w: WallClock, timeZone: string): ZonedResult {
  const asUtc = wallClockMs(w);
  const before = utcOffsetMinutes(new Date(asUtc - DAY_MS), timeZone);
  const after = utcOffsetMinutes(new Date(asUtc + DAY_MS), timeZone);
  if (before === after) return { ok: true, instant: new Date(asUtc - before * 60_000) };
  const found: Array<[number, number]> = [];
  for (const offset of [before, after]) {
    const candidate = asUtc - offset * 60_000;
    if (wallClockMs(wallClockAt(new Date(candidate), timeZone)) === asUtc) found.push([candidate, offset]);
  }
  found.sort((a, b) => a[0] - b[0]);
  const [first] = found;
  if (!first) return { ok: false, reason: "nonexistent" };
  if (found.length > 1) return { ok: false, reason: "ambiguous", offsets: found.map(([, offset]) => offset) };
  return { ok: true, instant: new Date(first[0]) };
}

const pad = (n: number, width = 2) => String(n).padStart(width, "0");

/** "+02:00", "-03:00", "+05:45". */
export function formatOffset(minutes: number): string {
  const abs = Math.abs(minutes);
  return `${minutes < 0 ? "-" : "+"}${pad(Math.floor(abs / 60))}:${pad(abs % 60)}`;
}

/** "2027-03-28T03:00:00+02:00": the site's wall clock with its offset, exact and readable. */
export function formatZonedIso(instant: Date, timeZone: string): string {
  const w = wallClockAt(instant, timeZone);
  const offset = formatOffset(utcOffsetMinutes(instant, timeZone));
  return `${pad(w.year, 4)}-${pad(w.month)}-${pad(w.day)}T${pad(w.hour)}:${pad(w.minute)}:${pad(w.second)}${offset}`;
}
