import { z } from "zod";
import { idField, utInstantField } from "@/lib/validation/fields";

/** GET /api/v1/ledger and the ledger page's filters. */
export const ledgerQuerySchema = z.object({
  semester: z.uuid("Unknown semester.").optional(),
  partner: z.uuid("Unknown partner.").optional(),
  format: z.enum(["json", "csv"], "Ask for json or csv.").optional().default("json"),
});
export type LedgerQuery = z.infer<typeof ledgerQuerySchema>;

/** Scheduling a payback block: the form (UT wall-clock strings) and the server share it. */
export const paybackSchema = z
  .object({
    programId: idField("Choose the program to repay."),
    telescopeId: idField("Choose a telescope."),
    startsAt: utInstantField("Give the start (UT)."),
    endsAt: utInstantField("Give the end (UT)."),
    note: z.string().trim().max(500, "Keep the note under 500 characters.").optional().default(""),
  })
  .refine((p) => p.endsAt > p.startsAt, { message: "The end must come after the start.", path: ["endsAt"] });
export type PaybackInput = z.output<typeof paybackSchema>;
export type PaybackFormValues = z.input<typeof paybackSchema>;
