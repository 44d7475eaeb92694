/**
 * Field schemas shared by the admin forms and their server actions. Form inputs arrive as
 * strings (an empty box is ""), the server may also get numbers or Dates: every helper
 * accepts both and answers with one plain message per field.
 */
import { z } from "zod";

/** Short identifiers such as "AQ41" or "SCI-101": no spaces, so they read well in tables and URLs. */
export function codeField(noun: string) {
  return z
    .string({ error: `Enter the ${noun}'s code.` })
    .trim()
    .min(1, `Enter the ${noun}'s code.`)
    .max(32, "Use at most 32 characters.")
    // Empty passes here so that an empty box gets one message, not two.
    .regex(/^(?:[A-Za-z0-9][A-Za-z0-9._-]*)?$/, "Use letters, digits, dots, hyphens or underscores, without spaces.");
}

export function textField(required: string, max = 200) {
  return z.string({ error: required }).trim().min(1, required).max(max, `Use at most ${max} characters.`);
}

export function idField(message: string) {
  return z.string({ error: message }).pipe(z.uuid(message));
}

interface NumberRule {
  required: string;
  /** The message for any value outside [min, max] (or not a whole number when `integer`). */
  range: string;
  min: number;
  max: number;
  minExclusive?: boolean;
  integer?: boolean;
}

export function numberField(rule: NumberRule) {
  return z
    .union([z.number(), z.string()], { error: rule.required })
    .transform((v) => (typeof v === "number" ? v : v.trim() === "" ? undefined : Number(v.trim())))
    .pipe(
      z
        .number({ error: (issue) => (issue.input === undefined ? rule.required : "Enter a number, using a dot for decimals.") })
        .refine((n) => (rule.minExclusive ? n > rule.min : n >= rule.min) && n <= rule.max, rule.range)
        .refine((n) => !rule.integer || Number.isInteger(n), rule.range),
    );
}

const UT_WALL_CLOCK = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?$/;

/** "2027-02-01T00:00" read as UT; a full ISO 8601 instant with a zone is accepted too. */
export function parseUtInstant(text: string): Date | undefined {
  const m = UT_WALL_CLOCK.exec(text.trim());
  if (m) {
    const [y, mo, d, h, mi, s] = m.slice(1).map((p) => Number(p ?? 0)) as [number, number, number, number, number, number];
    const date = new Date(Date.UTC(y, mo - 1, d, h, mi, s));
    // Date.UTC rolls 30 February over into March: refuse instead of guessing.
    const same = date.getUTCFullYear() === y && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d && h < 24 && mi < 60 && s < 60;
    return same ? date : undefined;
  }
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/.test(text.trim())) return undefined;
  const date = new Date(text.trim());
  return Number.isNaN(date.getTime()) ? undefined : date;
}

export function utInstantField(required: string) {
  return z
    .union([z.date(), z.string()], { error: required })
    .transform((v) => (v instanceof Date ? v : v.trim() === "" ? undefined : (parseUtInstant(v) ?? new Date(Number.NaN))))
    .pipe(z.date({ error: (issue) => (issue.input === undefined ? required : "Give a date and time in UT, e.g. 2027-02-01T00:00.") }));
}

/** The value a datetime-local input shows for a UTC instant. */
export function toUtInputValue(date: Date): string {
  return date.toISOString().slice(0, 16);
}

export function idListField(message: string) {
  return z.array(z.uuid(message), { error: message }).transform((ids) => [...new Set(ids)]);
}
