// The body of a visibility request, validated once and shared by the API route and the
// request form. Coordinates are read by the sky engine's parser, so a typo comes back as
// a field message saying what is wrong and where.

import { z } from "zod";
import { dayNumber, isValidTimeZone, parseDec, parseRa } from "../sky";

const MAX_NIGHTS = 366;
const MAX_EPHEMERIS_ROWS = 20_000;

function parsed(read: (s: string) => number) {
  return z.union([z.string(), z.number()]).transform((value, ctx) => {
    if (typeof value === "number") {
      if (!Number.isFinite(value)) {
        ctx.addIssue({ code: "custom", message: "must be a finite number of degrees" });
        return z.NEVER;
      }
      return value;
    }
    try {
      return read(value);
    } catch (e) {
      ctx.addIssue({ code: "custom", message: e instanceof Error ? e.message : String(e) });
      return z.NEVER;
    }
  });
}

/** RA as text ("12:34:56.7", "12h34m56.7s", "188.73°"…) or a number of degrees. A bare
 * decimal in text is degrees too; hours need their mark ("12.58h"). */
export const raField = parsed((s) => parseRa(s)).pipe(z.number().min(0).lt(360));
/** Dec as text ("-00 30 00", "+12°34′56″"…) or a number of degrees. */
export const decField = parsed(parseDec).pipe(z.number().min(-90).max(90));

const localDate = z
  .string()
  .refine((s) => dayNumber(s) !== null, { error: "must be a calendar date written YYYY-MM-DD" });

export const siteSchema = z.object({
  name: z.string().max(200).optional(),
  latitudeDeg: z.number().min(-90).max(90),
  longitudeDeg: z.number().min(-180).max(180),
  heightM: z.number().min(-500).max(9000),
  timeZone: z.string().refine(isValidTimeZone, { error: "must be an IANA time zone such as America/Santiago" }),
});

const range = (lo: number, hi: number) =>
  z
    .object({ min: z.number().min(lo).max(hi), max: z.number().min(lo).max(hi) })
    .refine((r) => r.min < r.max, { error: "min must be less than max", path: ["max"] });

export const telescopeSchema = z
  .object({
    name: z.string().max(200).optional(),
    minAltitudeDeg: z.number().min(-5).max(89),
    maxAltitudeDeg: z.number().gt(0).max(90).optional(),
    maxAirmass: z.number().min(1).max(40).optional(),
    hourAngleHours: range(-12, 12).optional(),
    declinationDeg: range(-90, 90).optional(),
    sunAvoidanceDeg: z.number().min(0).max(180),
  })
  .refine((t) => t.maxAltitudeDeg === undefined || t.maxAltitudeDeg > t.minAltitudeDeg, {
    error: "must be above minAltitudeDeg",
    path: ["maxAltitudeDeg"],
  });

const ephemerisRow = z.object({
  time: z.iso.datetime({ offset: true, error: "must be an ISO 8601 date-time with Z or an offset" }),
  ra: raField,
  dec: decField,
  rAu: z.number().positive().optional(),
  deltaAu: z.number().positive().optional(),
  magnitude: z.number().min(-30).max(40).optional(),
});

export const targetSchema = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("fixed"),
    name: z.string().max(200).optional(),
    ra: raField,
    dec: decField,
    pmRaMasPerYr: z.number().min(-20_000).max(20_000).optional(),
    pmDecMasPerYr: z.number().min(-20_000).max(20_000).optional(),
  }),
  z
    .object({
      kind: z.literal("ephemeris"),
      name: z.string().max(200).optional(),
      /** Absolute magnitude H and slope G for the H–G fading clock. */
      absoluteMagnitude: z.number().min(-10).max(40).optional(),
      slopeG: z.number().min(-0.5).max(1.5).optional(),
      rows: z.array(ephemerisRow).min(2).max(MAX_EPHEMERIS_ROWS),
    })
    .superRefine((t, ctx) => {
      let previous = -Infinity;
      t.rows.forEach((row, i) => {
        const ms = Date.parse(row.time);
        if (!(ms > previous)) {
          ctx.addIssue({ code: "custom", message: "times must increase from row to row", path: ["rows", i, "time"] });
        }
        previous = ms;
      });
      for (const key of ["deltaAu", "rAu"] as const) {
        const given = t.rows.filter((r) => r[key] !== undefined).length;
        if (given > 0 && given < t.rows.length) {
          const i = t.rows.findIndex((r) => r[key] === undefined);
          ctx.addIssue({ code: "custom", message: `give ${key} on every row or on none`, path: ["rows", i, key] });
        }
      }
      if (t.absoluteMagnitude !== undefined && !t.rows.every((r) => r.rAu !== undefined && r.deltaAu !== undefined)) {
        ctx.addIssue({
          code: "custom",
          message: "the H–G fading clock needs rAu and deltaAu on every row",
          path: ["absoluteMagnitude"],
        });
      }
    }),
]);

export const constraintsSchema = z.object({
  darkness: z.enum(["civil", "nautical", "astronomical"]).default("astronomical"),
  maxAirmass: z.number().min(1).max(40).optional(),
  minMoonSeparationDeg: z.number().min(0).max(180).optional(),
  maxMoonIllumination: z.number().min(0).max(1).optional(),
  minWindowMinutes: z.number().min(0).max(1440).optional(),
});

export const whenSchema = z
  .object({ night: localDate.optional(), from: localDate.optional(), to: localDate.optional() })
  .superRefine((w, ctx) => {
    if (w.night !== undefined) {
      if (w.from !== undefined || w.to !== undefined) {
        ctx.addIssue({ code: "custom", message: "give either night or from/to, not both", path: ["night"] });
      }
      return;
    }
    if (w.from === undefined) ctx.addIssue({ code: "custom", message: "give night, or from and to", path: ["from"] });
    if (w.to === undefined) ctx.addIssue({ code: "custom", message: "give night, or from and to", path: ["to"] });
    if (w.from !== undefined && w.to !== undefined) {
      const a = dayNumber(w.from);
      const b = dayNumber(w.to);
      if (a !== null && b !== null && b < a)
        ctx.addIssue({ code: "custom", message: "must not be before from", path: ["to"] });
      if (a !== null && b !== null && b - a + 1 > MAX_NIGHTS) {
        ctx.addIssue({ code: "custom", message: `at most ${MAX_NIGHTS} nights per request`, path: ["to"] });
      }
    }
  });

export const visibilityRequestSchema = z.object({
  site: siteSchema,
  telescope: telescopeSchema,
  instrument: z.object({ limitingMagnitude: z.number().min(-5).max(35) }).optional(),
  target: targetSchema,
  constraints: constraintsSchema.default({ darkness: "astronomical" }),
  when: whenSchema,
  options: z
    .object({
      refraction: z
        .union([
          z.boolean(),
          z.object({ pressureHpa: z.number().min(300).max(1100), temperatureC: z.number().min(-60).max(50) }),
        ])
        .default(false),
      stepMinutes: z.number().min(0.25).max(30).default(1),
      curveStepMinutes: z.number().min(1).max(60).default(5),
    })
    .default({ refraction: false, stepMinutes: 1, curveStepMinutes: 5 }),
});

/** What the route receives (before parsing). */
export type VisibilityRequestInput = z.input<typeof visibilityRequestSchema>;
/** What computeVisibility takes (after parsing: coordinates in degrees, defaults filled). */
export type VisibilityRequest = z.output<typeof visibilityRequestSchema>;
