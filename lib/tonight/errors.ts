/**
 * Refusals of tonight's queue. They extend the action errors, so a server action shows
 * their message as it is, and carry an HTTP status for the API (mapped in one place below).
 */
import { FieldError } from "@/lib/actions/domain-errors";
import { UserFacingError } from "@/lib/actions/result";
import { ApiError } from "@/lib/api/errors";

export class TonightNotFoundError extends UserFacingError {
  readonly status = 404;
}

export class TonightForbiddenError extends UserFacingError {
  readonly status = 403;
}

/** A refusal that belongs beside one field. */
export class TonightFieldError extends FieldError {
  readonly status = 400;
}

export function toTonightApiError(error: unknown): unknown {
  if (error instanceof TonightFieldError) return new ApiError(400, "invalid_input", error.message, { [error.field]: error.message });
  if (error instanceof TonightNotFoundError) return new ApiError(404, "not_found", error.message);
  if (error instanceof TonightForbiddenError) return new ApiError(403, "forbidden", error.message);
  return error;
}
