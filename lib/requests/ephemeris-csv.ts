/**
 * Ephemeris tables for moving targets, as CSV with our own column names. A header row is
 * required; names are case-insensitive, in any order; other columns are ignored; lines
 * starting with # are comments; comma, semicolon or tab separated.
 *
 *   utc       the instant: ISO 8601, "2026-12-01T22:00:00Z" (a space may replace the T;
 *             without a zone the time is UTC)
 *   ra        right ascension, ICRS/J2000, in any form the sky engine reads:
 *             "05:35:17.3", "05 35 17.3", "05h35m17.3s", "83.822" (a bare decimal is degrees)
 *   dec       declination, ICRS/J2000: "-05:23:28", "−5°23′28″", "-5.391"
 *   r_au      heliocentric distance r in au (optional; needed with delta_au for H–G)
 *   delta_au  geocentric distance Δ in au (optional; adds topocentric parallax)
 *   mag       predicted apparent magnitude (optional; used when no H is given)
 *
 * Pure and safe on any input: it never throws, it reports what it could not read.
 */
import Papa from "papaparse";
import type { StoredEphemerisRow } from "@/db/types";
import { CoordinateParseError, parseDec, parseRa } from "@/lib/sky";
import { MAX_EPHEMERIS_ROWS } from "./schemas";

export const EPHEMERIS_COLUMNS = ["utc", "ra", "dec", "r_au", "delta_au", "mag"] as const;

export interface EphemerisCsvIssue {
  /** 1-based data row (the header is row 0); absent for problems with the whole table. */
  row?: number;
  column?: string;
  message: string;
}

export interface EphemerisCsvResult {
  rows: StoredEphemerisRow[];
  issues: EphemerisCsvIssue[];
}

const MAX_ISSUES = 20;
const TIME = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(\.\d+)?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;

/** An instant from the utc column, or null. */
export function parseEphemerisTime(text: string): Date | null {
  const m = TIME.exec(text.trim());
  if (!m) return null;
  const [, y, mo, d, h, mi, s = "0", frac = "", zone = "Z"] = m;
  const ms = Date.UTC(Number(y), Number(mo) - 1, Number(d), Number(h), Number(mi), Number(s), Math.round(Number(`0${frac}`) * 1000));
  const check = new Date(ms);
  // Date.UTC rolls 31 April over into May: refuse it rather than guess.
  if (check.getUTCMonth() !== Number(mo) - 1 || check.getUTCDate() !== Number(d) || Number(h) > 23 || Number(mi) > 59 || Number(s) > 60) return null;
  if (zone.toUpperCase() === "Z") return check;
  const sign = zone.startsWith("-") ? -1 : 1;
  const digits = zone.slice(1).replace(":", "");
  const offset = sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2, 4)));
  return new Date(ms - offset * 60_000);
}

function readNumber(text: string | undefined): number | undefined | null {
  if (text === undefined || text.trim() === "") return undefined;
  const n = Number(text.trim());
  return Number.isFinite(n) ? n : null;
}

function coordinate(read: (s: string) => number, text: string): { value: number } | { error: string } {
  try {
    return { value: read(text) };
  } catch (error) {
    return { error: error instanceof CoordinateParseError ? error.message : "could not be read" };
  }
}

function parseRecords(text: string): { records: Record<string, string>[]; fields: string[] } | { error: string } {
  try {
    const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), {
      header: true,
      skipEmptyLines: "greedy",
      comments: "#",
      delimitersToGuess: [",", ";", "\t"],
      transformHeader: (h) => h.trim().toLowerCase(),
    });
    return { records: parsed.data.filter((r) => typeof r === "object" && r !== null), fields: parsed.meta.fields ?? [] };
  } catch {
    return { error: "The file could not be read as CSV." };
  }
}

export function parseEphemerisCsv(text: string): EphemerisCsvResult {
  const issues: EphemerisCsvIssue[] = [];
  const note = (issue: EphemerisCsvIssue) => {
    if (issues.length < MAX_ISSUES) issues.push(issue);
  };
  if (typeof text !== "string" || text.trim() === "") return { rows: [], issues: [{ message: "The file is empty." }] };
  const table = parseRecords(text);
  if ("error" in table) return { rows: [], issues: [{ message: table.error }] };
  const missing = ["utc", "ra", "dec"].filter((c) => !table.fields.includes(c));
  if (missing.length > 0) {
    return { rows: [], issues: [{ message: `Missing column${missing.length > 1 ? "s" : ""} ${missing.join(", ")}: the header row needs utc, ra, dec (and optionally r_au, delta_au, mag).` }] };
  }
  if (table.records.length > MAX_EPHEMERIS_ROWS) {
    return { rows: [], issues: [{ message: `The table has ${table.records.length} rows; use at most ${MAX_EPHEMERIS_ROWS} (a coarser step is fine: rows are interpolated).` }] };
  }

  const rows: StoredEphemerisRow[] = [];
  table.records.forEach((record, index) => {
    const row = index + 1;
    const time = parseEphemerisTime(record.utc ?? "");
    if (!time) return note({ row, column: "utc", message: `Row ${row}: "${(record.utc ?? "").slice(0, 40)}" is not an ISO 8601 time.` });
    const ra = coordinate((s) => parseRa(s), record.ra ?? "");
    if ("error" in ra) return note({ row, column: "ra", message: `Row ${row}: ${ra.error}` });
    const dec = coordinate(parseDec, record.dec ?? "");
    if ("error" in dec) return note({ row, column: "dec", message: `Row ${row}: ${dec.error}` });
    const out: StoredEphemerisRow = { time: time.toISOString(), ra: ra.value, dec: dec.value };
    for (const [column, key, positive] of [
      ["r_au", "rAu", true],
      ["delta_au", "deltaAu", true],
      ["mag", "magnitude", false],
    ] as const) {
      const value = readNumber(record[column]);
      if (value === null || (value !== undefined && positive && value <= 0)) {
        return note({ row, column, message: `Row ${row}: ${column} must be ${positive ? "a positive number" : "a number"}.` });
      }
      if (value !== undefined) out[key] = value;
    }
    rows.push(out);
  });
  if (issues.length > 0) return { rows: [], issues };

  for (let i = 1; i < rows.length; i++) {
    if (Date.parse(rows[i]!.time) <= Date.parse(rows[i - 1]!.time)) {
      return { rows: [], issues: [{ row: i + 1, column: "utc", message: `Row ${i + 1}: times must increase from row to row.` }] };
    }
  }
  for (const [column, key] of [
    ["r_au", "rAu"],
    ["delta_au", "deltaAu"],
  ] as const) {
    const given = rows.filter((r) => r[key] !== undefined).length;
    if (given > 0 && given < rows.length) return { rows: [], issues: [{ column, message: `Give ${column} on every row or on none.` }] };
  }
  if (rows.length < 2) return { rows: [], issues: [{ message: "An ephemeris needs at least two rows." }] };
  return { rows, issues: [] };
}
