import { z } from "zod";
import { instantSchema } from "@/lib/schedule/schemas";

const MAX_SLOT_HOURS = 24;

/** GET /api/v1/impact?telescope=&start=&end= — a telescope by id or code, and an ISO 8601 slot. */
export const impactQuerySchema = z
  .object({
    telescope: z.string({ error: "Name the telescope (its id or code)." }).trim().min(1, "Name the telescope (its id or code).").max(64),
    start: instantSchema,
    end: instantSchema,
  })
  .refine((q) => q.end > q.start, { message: "The slot must end after it starts.", path: ["end"] })
  .refine((q) => q.end.getTime() - q.start.getTime() <= MAX_SLOT_HOURS * 3_600_000, { message: `Keep the slot within ${MAX_SLOT_HOURS} hours.`, path: ["end"] });

export type ImpactQuery = z.infer<typeof impactQuerySchema>;
