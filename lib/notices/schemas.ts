import { z } from "zod";
import { NOTICE_EVENTS } from "@/db/types";

export const noticeIdSchema = z.uuid("Unknown notice.");

export const listNoticesQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
  unread: z.enum(["0", "1", "true", "false"]).optional().transform((v) => v === "1" || v === "true"),
});

/** Any subset of the events, each on (true) or off (false) for e-mail. */
export const emailPreferencesSchema = z.partialRecord(z.enum(NOTICE_EVENTS), z.boolean());

/** The preferences form: the events it showed, and those ticked for e-mail. */
export const preferencesFormSchema = z.object({ shown: z.array(z.enum(NOTICE_EVENTS)), email: z.array(z.enum(NOTICE_EVENTS)) });
