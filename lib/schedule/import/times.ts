/**
 * Reading the start and end cells of a row. Accepted: ISO 8601 with an offset or Z
 * ("2027-03-01T23:00:00Z", "2027-03-01T20:00-03:00"), or a local wall-clock time
 * ("2027-03-01 20:00", "2027-03-01T20:00:00") read in the row's IANA time zone.
 */
import { isKnownTimeZone, isValidWallClock, zonedToUtc, type WallClock } from "./zoned-time";

export type TimeFailure =
  | { kind: "missing" }
  | { kind: "bad" }
  | { kind: "zone_missing" }
  | { kind: "zone_unknown" }
  | { kind: "nonexistent" }
  | { kind: "ambiguous"; offsets: number[] };

export type TimeResult = { ok: true; instant: Date } | { ok: false; failure: TimeFailure };

const PATTERN = /^(\d{4})-(\d{2})-(\d{2})[Tt ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?\s*(Z|z|[+-]\d{2}(?::?\d{2})?)?$/;

function offsetMinutes(text: string): number | null {
  if (/^z$/i.test(text)) return 0;
  const sign = text.startsWith("-") ? -1 : 1;
  const digits = text.slice(1).replace(":", "");
  const hours = Number(digits.slice(0, 2));
  const minutes = digits.length > 2 ? Number(digits.slice(2, 4)) : 0;
  if (hours > 18 || minutes > 59) return null;
  return sign * (hours * 60 + minutes);
}

export function parseImportTime(raw: string, timeZone: string): TimeResult {
  const text = raw.trim();
  if (!text) return { ok: false, failure: { kind: "missing" } };
  const m = PATTERN.exec(text);
  if (!m) return { ok: false, failure: { kind: "bad" } };
  const w: WallClock = {
    year: Number(m[1]),
    month: Number(m[2]),
    day: Number(m[3]),
    hour: Number(m[4]),
    minute: Number(m[5]),
    second: Number(m[6] ?? 0),
  };
  if (!isValidWallClock(w)) return { ok: false, failure: { kind: "bad" } };
  const ms = m[7] ? Math.floor(Number(`0.${m[7]}`) * 1000) : 0;

  if (m[8]) {
    const offset = offsetMinutes(m[8]);
    if (offset === null) return { ok: false, failure: { kind: "bad" } };
    const asUtc = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second, ms);
    return { ok: true, instant: new Date(asUtc - offset * 60_000) };
  }
  const zone = timeZone.trim();
  if (!zone) return { ok: false, failure: { kind: "zone_missing" } };
  if (!isKnownTimeZone(zone)) return { ok: false, failure: { kind: "zone_unknown" } };
  const zoned = zonedToUtc(w, zone);
  if (!zoned.ok) return { ok: false, failure: zoned.reason === "ambiguous" ? { kind: "ambiguous", offsets: zoned.offsets } : { kind: "nonexistent" } };
  return { ok: true, instant: new Date(zoned.instant.getTime() + ms) };
}
