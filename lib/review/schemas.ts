/**
 * The director's decision, validated once for the review page's forms and for
 * POST /api/v1/too-requests/{id}/decision. Times: ISO 8601 with a zone, or a UT wall
 * clock ("2027-02-01T23:10") as the form's inputs send.
 */
import { z } from "zod";
import { idField, utInstantField } from "@/lib/validation/fields";

// The note is also kept in the request's history (request_events.note, at most 2000 characters).
const MAX_NOTE = 2000;

export const approveDecisionSchema = z
  .object({
    decision: z.literal("approve"),
    telescopeId: idField("Choose the telescope."),
    start: utInstantField("Give the slot's start (UT)."),
    end: utInstantField("Give the slot's end (UT)."),
    note: z.string().trim().max(MAX_NOTE, `Keep the note under ${MAX_NOTE} characters.`).optional().default(""),
  })
  .refine((d) => d.end > d.start, { message: "The slot must end after it starts.", path: ["end"] })
  .refine((d) => d.end.getTime() - d.start.getTime() <= 24 * 3_600_000, { message: "Keep the slot within 24 hours.", path: ["end"] });

export const declineDecisionSchema = z.object({
  decision: z.literal("decline"),
  reason: z.string({ error: "Give the PI a reason for declining." }).trim().min(1, "Give the PI a reason for declining.").max(MAX_NOTE, `Keep the reason under ${MAX_NOTE} characters.`),
});

export const returnDecisionSchema = z.object({
  decision: z.literal("return"),
  note: z.string({ error: "Tell the PI what to change." }).trim().min(1, "Tell the PI what to change.").max(MAX_NOTE, `Keep the note under ${MAX_NOTE} characters.`),
});

export const decisionSchema = z.discriminatedUnion("decision", [approveDecisionSchema, declineDecisionSchema, returnDecisionSchema], {
  error: "Say approve, decline or return.",
});

export type DecisionInput = z.output<typeof decisionSchema>;
export type ApproveDecisionValues = z.input<typeof approveDecisionSchema>;
