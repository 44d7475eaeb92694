// zod issues → { "field.path": "message" } for a 400 answer or for messages beside form fields.

import type { z } from "zod";

/** One message per field, the first one zod reported; "" is the body itself. */
export function zodErrorToFieldMessages(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map((p) => String(p)).join(".");
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}
