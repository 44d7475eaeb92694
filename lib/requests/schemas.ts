/**
 * The ToO request, validated once for the form (react-hook-form's resolver), the server
 * actions and POST /api/v1/too-requests. Inputs are what a form sends (strings) or what
 * the API sends (numbers, ISO 8601); outputs are degrees, Dates and numbers.
 *
 * Times without a zone ("2026-12-01T22:00") are UT. The window: the observation may be
 * made between `earliestStart` and `latestEnd`; `deadline` is when the result stops being
 * useful (the request lapses then). Feasibility looks for windows inside both.
 */
import { z } from "zod";
import { DARKNESS_LEVELS, REQUEST_URGENCIES, TARGET_KINDS } from "@/db/types";
import { idField, numberField, textField, utInstantField } from "@/lib/validation/fields";
import { decField, ephemerisRowSchema, optionalNumberField, raField } from "./fields";

export const MAX_EPHEMERIS_ROWS = 5000;
export const MAX_WINDOW_DAYS = 31;
export const MAX_TELESCOPES = 10;
const DAY_MS = 86_400_000;

const rawCoordinate = z.union([z.string().max(100, "Use at most 100 characters."), z.number()], { error: "Give the coordinate as text or a number of degrees." }).optional();
const rawNumber = z.union([z.number(), z.string(), z.null()], { error: "Enter a number, using a dot for decimals." }).optional();
const hMagField = optionalNumberField({ min: -10, max: 40, range: "H runs from −10 to 40." });
const gSlopeField = optionalNumberField({ min: -0.5, max: 1.5, range: "G runs from −0.5 to 1.5 (0.15 when unknown)." });

/** The target as the service uses it: degrees for a fixed one, rows (and H, G) for a moving one. */
export interface TargetOutput {
  kind: (typeof TARGET_KINDS)[number];
  ra?: number;
  dec?: number;
  ephemeris?: z.output<typeof ephemerisRowSchema>[];
  hMag?: number;
  gSlope?: number;
}

/** Runs a field schema on one value, reporting its issues under `path`; undefined when it failed. */
function field<S extends z.ZodType>(schema: S, value: unknown, path: string, ctx: z.RefinementCtx): z.output<S> | undefined {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  for (const issue of parsed.error.issues) ctx.addIssue({ code: "custom", message: issue.message, path: [path, ...issue.path] });
  return undefined;
}

const blank = (v: unknown) => v === undefined || v === null || (typeof v === "string" && v.trim() === "");

function missing(ctx: z.RefinementCtx, path: string, message: string): undefined {
  ctx.addIssue({ code: "custom", path: [path], message });
  return undefined;
}

/**
 * Only the fields of the chosen kind are read: coordinates typed before switching to an
 * ephemeris (or H typed before switching back) never block the request.
 */
export const targetSchema = z
  .object({
    kind: z.enum(TARGET_KINDS, "Choose fixed coordinates or an ephemeris."),
    ra: rawCoordinate.meta({ description: "Fixed targets: RA (ICRS/J2000) as text in any usual form, or degrees." }),
    dec: rawCoordinate.meta({ description: "Fixed targets: Dec (ICRS/J2000) as text in any usual form, or degrees." }),
    ephemeris: z
      .array(ephemerisRowSchema)
      .max(MAX_EPHEMERIS_ROWS, `Use at most ${MAX_EPHEMERIS_ROWS} ephemeris rows.`)
      .optional()
      .meta({ description: "Moving targets: the ephemeris rows, in increasing time." }),
    hMag: rawNumber.meta({ description: "Moving targets: absolute magnitude H for the fading clock (needs rAu and deltaAu)." }),
    gSlope: rawNumber.meta({ description: "Moving targets: slope parameter G (0.15 when absent)." }),
  })
  .transform((t, ctx): TargetOutput => {
    if (t.kind === "fixed") {
      const ra = blank(t.ra) ? missing(ctx, "ra", "Enter the right ascension, e.g. 05:35:17.3.") : field(raField, t.ra, "ra", ctx);
      const dec = blank(t.dec) ? missing(ctx, "dec", "Enter the declination, e.g. −05:23:28.") : field(decField, t.dec, "dec", ctx);
      return { kind: "fixed", ra, dec };
    }
    const hMag = field(hMagField, t.hMag, "hMag", ctx);
    const gSlope = field(gSlopeField, t.gSlope, "gSlope", ctx);
    const rows = t.ephemeris ?? [];
    if (rows.length < 2) {
      ctx.addIssue({ code: "custom", path: ["ephemeris"], message: "Upload an ephemeris table with at least two rows." });
      return { kind: "ephemeris" };
    }
    for (let i = 1; i < rows.length; i++) {
      if (Date.parse(rows[i]!.time) <= Date.parse(rows[i - 1]!.time)) {
        ctx.addIssue({ code: "custom", path: ["ephemeris", i, "time"], message: `Row ${i + 1}: times must increase from row to row.` });
        break;
      }
    }
    for (const key of ["rAu", "deltaAu"] as const) {
      const given = rows.filter((r) => r[key] !== undefined).length;
      if (given > 0 && given < rows.length) {
        ctx.addIssue({ code: "custom", path: ["ephemeris"], message: `Give ${key === "rAu" ? "r_au" : "delta_au"} on every row or on none.` });
      }
    }
    if (hMag !== undefined && !rows.every((r) => r.rAu !== undefined && r.deltaAu !== undefined)) {
      ctx.addIssue({ code: "custom", path: ["hMag"], message: "The fading clock from H needs r_au and delta_au on every ephemeris row." });
    }
    return { kind: "ephemeris", ephemeris: rows, hMag, gSlope };
  });

export const constraintsSchema = z.object({
  maxAirmass: optionalNumberField({ min: 1, max: 5, range: "Airmass runs from 1 (zenith) to 5." }),
  darkness: z.enum(DARKNESS_LEVELS, "Choose civil, nautical or astronomical darkness."),
  minMoonSeparationDeg: optionalNumberField({ min: 0, max: 180, range: "Give 0 to 180 degrees." }),
  maxMoonIllumination: optionalNumberField({ min: 0, max: 1, range: "Give a fraction from 0 (new) to 1 (full)." }),
});

const windowFields = {
  durationMinutes: numberField({ required: "Give the time needed, in minutes.", min: 1, max: 720, integer: true, range: "Give whole minutes, 1 to 720." }),
  earliestStart: utInstantField("Give the earliest start (UT)."),
  latestEnd: utInstantField("Give the latest end (UT)."),
  deadline: utInstantField("Give the deadline (UT)."),
};

interface WindowValues {
  durationMinutes: number;
  earliestStart: Date;
  latestEnd: Date;
  deadline: Date;
}

function checkWindow(w: WindowValues, ctx: z.RefinementCtx): void {
  const start = w.earliestStart.getTime();
  if (w.latestEnd.getTime() <= start) ctx.addIssue({ code: "custom", path: ["latestEnd"], message: "The latest end must come after the earliest start." });
  if (w.deadline.getTime() <= start) ctx.addIssue({ code: "custom", path: ["deadline"], message: "The deadline must come after the earliest start." });
  if (w.latestEnd.getTime() - start > MAX_WINDOW_DAYS * DAY_MS) {
    ctx.addIssue({ code: "custom", path: ["latestEnd"], message: `Keep the window within ${MAX_WINDOW_DAYS} days of the earliest start.` });
  }
  const usable = Math.min(w.latestEnd.getTime(), w.deadline.getTime()) - start;
  if (usable > 0 && w.durationMinutes * 60_000 > usable) {
    ctx.addIssue({ code: "custom", path: ["durationMinutes"], message: "The time needed is longer than the window before the deadline." });
  }
}

const telescopeIdsField = z
  .array(z.uuid("Unknown telescope."), { error: "Choose at least one telescope." })
  .min(1, "Choose at least one telescope.")
  .max(MAX_TELESCOPES, `Choose at most ${MAX_TELESCOPES} telescopes.`)
  .transform((ids) => [...new Set(ids)]);

export const requestSchema = z
  .object({
    programId: idField("Choose the ToO program this request is charged to."),
    targetName: textField("Name the target.", 120),
    target: targetSchema,
    telescopeIds: telescopeIdsField,
    instrumentId: idField("Choose an instrument."),
    ...windowFields,
    urgency: z.enum(REQUEST_URGENCIES, "Choose how urgent this is."),
    constraints: constraintsSchema,
    justification: z
      .string({ error: "Give the scientific justification." })
      .trim()
      .min(20, "Give the scientific justification (at least 20 characters).")
      .max(20_000, "Keep the justification under 20 000 characters; attach a PDF for more."),
  })
  .superRefine(checkWindow);

/** What the form holds and the API accepts. */
export type RequestFormValues = z.input<typeof requestSchema>;
/** What the service stores: degrees, Dates, numbers. */
export type RequestInput = z.output<typeof requestSchema>;

/** The live feasibility preview: the fields that decide observability, nothing else. */
export const feasibilityInputSchema = z
  .object({
    target: targetSchema,
    telescopeIds: telescopeIdsField,
    instrumentId: z.union([z.uuid(), z.literal("")]).optional().transform((v) => (v === "" ? undefined : v)),
    ...windowFields,
    constraints: constraintsSchema,
  })
  .superRefine(checkWindow);
export type FeasibilityInput = z.output<typeof feasibilityInputSchema>;

export const withdrawSchema = z.object({
  note: z.string().trim().max(2000, "Keep the note under 2000 characters.").optional().default(""),
});

/**
 * A draft as the form autosaves it: anything the person has typed so far, loosely
 * shaped; lib/requests/fields-map.ts keeps what parses and the typed coordinate text.
 */
const loose = z.union([z.string().max(20_000), z.number(), z.null()]).optional();
export const draftInputSchema = z.object({
  programId: loose,
  targetName: loose,
  target: z
    .object({
      kind: z.enum(TARGET_KINDS).optional(),
      ra: loose,
      dec: loose,
      ephemeris: z.array(z.unknown()).max(MAX_EPHEMERIS_ROWS, `Use at most ${MAX_EPHEMERIS_ROWS} ephemeris rows.`).optional(),
      hMag: loose,
      gSlope: loose,
    })
    .optional(),
  telescopeIds: z.array(z.string().max(100)).max(MAX_TELESCOPES).optional(),
  instrumentId: loose,
  durationMinutes: loose,
  earliestStart: loose,
  latestEnd: loose,
  deadline: loose,
  urgency: loose,
  constraints: z.object({ maxAirmass: loose, darkness: loose, minMoonSeparationDeg: loose, maxMoonIllumination: loose }).partial().optional(),
  justification: loose,
});
export type DraftInput = z.output<typeof draftInputSchema>;
