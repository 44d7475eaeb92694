/**
 * Field schemas for ToO requests that the shared helpers in lib/validation do not cover:
 * coordinates read by the sky engine's parser (its message names the character at fault),
 * optional numbers where an empty box means "no constraint", and ephemeris rows.
 * Each accepts what a form sends (strings) and what the API sends (numbers).
 */
import { z } from "zod";
import { CoordinateParseError, parseDec, parseRa } from "@/lib/sky";

type Reader = (text: string) => number;

/** Text in any form the sky parser accepts, or a number of degrees; "" and absent give undefined. */
function coordinateField(read: Reader, min: number, max: number, maxExclusive: boolean, range: string) {
  return z
    .union([z.string().max(100, "Use at most 100 characters."), z.number()], { error: "Give the coordinate as text or a number of degrees." })
    .optional()
    .transform((value, ctx): number | undefined => {
      if (value === undefined) return undefined;
      if (typeof value === "number") {
        const inside = Number.isFinite(value) && value >= min && (maxExclusive ? value < max : value <= max);
        if (!inside) ctx.addIssue({ code: "custom", message: range });
        return inside ? value : z.NEVER;
      }
      const text = value.trim();
      if (text === "") return undefined;
      try {
        return read(text);
      } catch (error) {
        if (!(error instanceof CoordinateParseError)) throw error;
        ctx.addIssue({ code: "custom", message: error.message });
        return z.NEVER;
      }
    });
}

export const raField = coordinateField((s) => parseRa(s), 0, 360, true, "Right ascension in degrees runs from 0 up to (not including) 360.");
export const decField = coordinateField(parseDec, -90, 90, false, "Declination runs from −90° to +90°.");

/** A number where an empty box means "not given". */
export function optionalNumberField(rule: { min: number; max: number; range: string; integer?: boolean }) {
  return z
    .union([z.number(), z.string(), z.null()], { error: "Enter a number, using a dot for decimals." })
    .optional()
    .transform((v) => (v === null || v === undefined ? undefined : typeof v === "number" ? v : v.trim() === "" ? undefined : Number(v.trim())))
    .pipe(
      z
        .number({ error: "Enter a number, using a dot for decimals." })
        .refine((n) => n >= rule.min && n <= rule.max && (!rule.integer || Number.isInteger(n)), rule.range)
        .optional(),
    );
}

const ISO_INSTANT = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/;

/** One ephemeris row: a UTC instant (ISO 8601 with a zone), RA/Dec (ICRS), optional r, Δ (au) and magnitude. */
export const ephemerisRowSchema = z
  .object({
    time: z
      .string({ error: "Give the time as ISO 8601 with Z or an offset." })
      .regex(ISO_INSTANT, "Give the time as ISO 8601 with Z or an offset, e.g. 2026-12-01T22:00:00Z.")
      .refine((s) => !Number.isNaN(Date.parse(s)), "That is not a real date.")
      .transform((s) => new Date(s).toISOString()),
    ra: raField.pipe(z.number({ error: "Give the right ascension." })),
    dec: decField.pipe(z.number({ error: "Give the declination." })),
    rAu: z.number().positive("r must be a positive number of au.").max(1000).optional(),
    deltaAu: z.number().positive("Δ must be a positive number of au.").max(1000).optional(),
    magnitude: z.number().min(-30).max(40).optional(),
  })
  .meta({ description: "One row of an ephemeris: UTC time, geocentric astrometric RA/Dec (ICRS), optional r and Δ in au, optional magnitude." });

export type EphemerisRowInput = z.input<typeof ephemerisRowSchema>;
