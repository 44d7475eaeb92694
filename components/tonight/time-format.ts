import { formatLocal, formatUt } from "@/lib/time/format";

/** "23:40" in UT. */
export function clockUt(iso: string): string {
  return formatUt(new Date(iso)).slice(11);
}

/** "20:40 GMT-3" at the site. */
export function clockLocal(iso: string, timeZone: string): string {
  return formatLocal(new Date(iso), timeZone).slice(11);
}

/** The local calendar date differs from the one the night began on: mark it "+1". */
export function localDay(iso: string, timeZone: string): string {
  return formatLocal(new Date(iso), timeZone).slice(0, 10);
}

/** The date after a YYYY-MM-DD (or before, with -1). */
export function shiftDate(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** "20:30–23:30 GMT-3", or "20:30 GMT-3–23:30 GMT-4" when the site's clocks change in between. */
export function localRange(startIso: string, endIso: string, timeZone: string): string {
  const a = clockLocal(startIso, timeZone);
  const b = clockLocal(endIso, timeZone);
  return a.slice(6) === b.slice(6) ? `${a.slice(0, 5)}–${b}` : `${a}–${b}`;
}

/** "2027-04-04 03:30–05:00 UT" (the date is the start's UT date). */
export function utRange(startIso: string, endIso: string): string {
  return `${startIso.slice(0, 10)} ${clockUt(startIso)}–${clockUt(endIso)} UT`;
}
