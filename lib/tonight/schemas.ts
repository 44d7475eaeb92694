/**
 * Inputs of tonight's queue, shared by the page, the server actions and the API routes.
 */
import { z } from "zod";
import { EXECUTION_OUTCOMES } from "@/db/types";

/** A telescope named in a URL: its uuid or its code. */
export const telescopeRefSchema = z
  .string()
  .trim()
  .min(1, "Name a telescope by its id or code.")
  .max(64, "That is not a telescope id or code.");

function isCalendarDate(s: string): boolean {
  const d = new Date(`${s}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
}

/** "Night of" a local date; limited to years where the sky engine's time scales are meant to be used. */
export const nightOfSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Give the night as YYYY-MM-DD (the local date on which it begins).")
  .refine(isCalendarDate, "That is not a calendar date.")
  .refine((s) => s >= "1950-01-01" && s <= "2150-12-31", "Choose a night between 1950 and 2150.");

export const queueQuerySchema = z.object({ night: nightOfSchema.optional() });

export const acknowledgeSchema = z.object({
  throughChangeId: z.number({ error: "Say which change you have seen up to." }).int().positive(),
});
export type AcknowledgeInput = z.output<typeof acknowledgeSchema>;

/** Empty form fields (and NaN from a cleared number input) mean "not given". */
const optionalMinutes = z.preprocess(
  (v) => (v === "" || v === undefined || (typeof v === "number" && Number.isNaN(v)) ? null : v),
  z
    .number({ error: "Minutes must be a number." })
    .int("Whole minutes, please.")
    .min(0, "Minutes cannot be negative.")
    .max(1440, "A block is at most 1440 minutes long.")
    .nullable(),
);

export const executionLogSchema = z
  .object({
    outcome: z.enum(EXECUTION_OUTCOMES, { error: "Choose what happened." }),
    minutesUsed: optionalMinutes,
    note: z.string().trim().max(4000, "Keep the note under 4000 characters.").default(""),
  })
  .superRefine((v, ctx) => {
    // "Partial" is only meaningful with the minutes actually observed.
    if (v.outcome === "partial" && !(v.minutesUsed !== null && v.minutesUsed > 0)) {
      ctx.addIssue({ code: "custom", path: ["minutesUsed"], message: "Say how many minutes were observed." });
    }
  });
export type ExecutionLogFormValues = z.input<typeof executionLogSchema>;
export type ExecutionLogInput = z.output<typeof executionLogSchema>;
