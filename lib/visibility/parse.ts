import { zodErrorToFieldMessages } from "./field-errors";
import { type VisibilityRequest, visibilityRequestSchema } from "./schema";

export type ParsedVisibilityRequest =
  { ok: true; data: VisibilityRequest } | { ok: false; fieldErrors: Record<string, string> };

/** Validate an unknown JSON body; on failure, one message per field path ("target.ra"). */
export function parseVisibilityRequest(body: unknown): ParsedVisibilityRequest {
  const result = visibilityRequestSchema.safeParse(body);
  return result.success
    ? { ok: true, data: result.data }
    : { ok: false, fieldErrors: zodErrorToFieldMessages(result.error) };
}
