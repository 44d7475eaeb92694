import { z } from "zod";
import { BLOCK_KINDS } from "@/db/types";

/** An ISO 8601 instant with an explicit offset or Z ("2026-12-02T04:30:00Z"). */
export const instantSchema = z.iso
  .datetime({ offset: true, message: "Give an ISO 8601 time with a zone, e.g. 2026-12-02T04:30:00Z." })
  .transform((s) => new Date(s));

export const blockKindSchema = z.enum(BLOCK_KINDS);

const blockFields = {
  telescopeId: z.uuid("Choose a telescope."),
  programId: z.uuid("Choose a program."),
  observerUserId: z.uuid("Choose an observer.").nullable().optional(),
  instrumentId: z.uuid("Choose an instrument.").nullable().optional(),
  kind: blockKindSchema,
  startsAt: instantSchema,
  endsAt: instantSchema,
  notes: z.string().max(2000, "Keep notes under 2000 characters.").optional(),
};

const endAfterStart = (b: { startsAt?: Date; endsAt?: Date }) => !b.startsAt || !b.endsAt || b.endsAt > b.startsAt;
const endAfterStartIssue = { message: "The end must come after the start.", path: ["endsAt"] };

export const blockInputSchema = z.object(blockFields).refine(endAfterStart, endAfterStartIssue);
export type BlockInput = z.infer<typeof blockInputSchema>;

/** Moving or resizing: any subset of the fields. */
export const blockPatchSchema = z.object(blockFields).partial().refine(endAfterStart, endAfterStartIssue);
export type BlockPatch = z.infer<typeof blockPatchSchema>;

export const scheduleQuerySchema = z
  .object({
    telescope: z.uuid("Unknown telescope.").optional(),
    from: instantSchema,
    to: instantSchema,
  })
  .refine((q) => q.to > q.from, { message: "`to` must come after `from`.", path: ["to"] })
  .refine((q) => q.to.getTime() - q.from.getTime() <= 400 * 86_400_000, { message: "Ask for at most 400 days at a time.", path: ["to"] });
