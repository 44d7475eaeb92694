import { z } from "zod";
import { instantSchema } from "@/lib/schedule/schemas";

export const EXPORT_FORMATS = ["csv", "ics"] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

// A plain HTML form sends "" for an unchosen select: treat it as absent.
const optional = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (v === "" || v === null ? undefined : v), schema.optional());

/** GET /api/v1/schedule/export?format=csv|ics&telescope=&program=&observer=&from=&to= */
export const exportQuerySchema = z
  .object({
    format: z.enum(EXPORT_FORMATS, "Choose csv or ics."),
    telescope: optional(z.uuid("Unknown telescope.")),
    program: optional(z.uuid("Unknown program.")),
    observer: optional(z.uuid("Unknown observer.")),
    from: optional(instantSchema),
    to: optional(instantSchema),
  })
  .refine((q) => !q.from || !q.to || q.to > q.from, { message: "`to` must come after `from`.", path: ["to"] });
export type ExportQuery = z.infer<typeof exportQuerySchema>;
