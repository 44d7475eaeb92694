// Time-zone arithmetic with the platform's Intl (IANA zones, DST included) — the only
// way to get local dates right in both browser and server without a zone database.

import type { Instant } from "./time-scales";

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat("en-US", {
      timeZone,
      hourCycle: "h23",
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      second: "2-digit",
    });
    formatters.set(timeZone, f);
  }
  return f;
}

/** True when the platform knows this IANA time-zone name. */
export function isValidTimeZone(timeZone: string): boolean {
  try {
    formatter(timeZone);
    return true;
  } catch {
    return false;
  }
}

// Offsets per zone and UTC hour. An hour whose two ends have the same offset has that
// offset throughout (zones change at most once in an hour), so it is kept; an hour with a
// change in it is answered exactly each time. Intl formatting is the engine's slowest
// step when a report gives every instant in local time as well.
const HOUR_MS = 3_600_000;
const MAX_HOURS_KEPT = 20_000;
const steadyHours = new Map<string, number>();

/** Offset of local civil time from UTC at an instant, milliseconds (east positive). */
export function timeZoneOffsetMs(timeZone: string, t: Instant): number {
  const hour = Math.floor(t / HOUR_MS);
  const key = `${timeZone}|${hour}`;
  const steady = steadyHours.get(key);
  if (steady !== undefined) return steady;
  const atStart = exactOffsetMs(timeZone, hour * HOUR_MS);
  if (atStart === exactOffsetMs(timeZone, (hour + 1) * HOUR_MS - 1000)) {
    if (steadyHours.size >= MAX_HOURS_KEPT) steadyHours.clear();
    steadyHours.set(key, atStart);
    return atStart;
  }
  return exactOffsetMs(timeZone, t);
}

function exactOffsetMs(timeZone: string, t: Instant): number {
  const parts = formatter(timeZone).formatToParts(new Date(Math.floor(t / 1000) * 1000));
  const get = (type: string): number => Number(parts.find((p) => p.type === type)?.value ?? 0);
  const asUtc = Date.UTC(get("year"), get("month") - 1, get("day"), get("hour"), get("minute"), get("second"));
  return asUtc - Math.floor(t / 1000) * 1000;
}

function pad(n: number, width = 2): string {
  return String(n).padStart(width, "0");
}

/** ISO 8601 UTC with whole seconds, e.g. 2025-03-29T21:04:13Z. */
export function formatUtcIso(t: Instant): string {
  // Whole seconds: the milliseconds are ".000"; slicing them off is cheaper than a replace.
  return `${new Date(Math.round(t / 1000) * 1000).toISOString().slice(0, 19)}Z`;
}

/** ISO 8601 local time with offset, e.g. 2025-03-29T22:04:13+01:00. */
export function formatLocalIso(t: Instant, timeZone: string): string {
  const rounded = Math.round(t / 1000) * 1000;
  const offset = timeZoneOffsetMs(timeZone, rounded);
  const local = new Date(rounded + offset).toISOString().slice(0, 19);
  const sign = offset < 0 ? "-" : "+";
  const minutes = Math.abs(offset) / 60000;
  return `${local}${sign}${pad(Math.floor(minutes / 60))}:${pad(minutes % 60)}`;
}

/** Days since 1970-01-01 of a "YYYY-MM-DD" date, or null if it is not a real date. */
export function dayNumber(date: string): number | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (!m) return null;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const ms = Date.UTC(y, mo - 1, d);
  const back = new Date(ms);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d) return null;
  return ms / 86_400_000;
}

export function dateFromDayNumber(day: number): string {
  return new Date(day * 86_400_000).toISOString().slice(0, 10);
}
