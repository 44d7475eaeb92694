import { ApiError } from "@/lib/api/errors";
import { IdempotencyConflictError, RequestFieldError, RequestNotFoundError, RequestRefusedError, RequestStateError } from "./errors";

/** The request service's refusals as HTTP answers (used by the /api/v1/too-requests handlers). */
export function toRequestApiError(error: unknown): unknown {
  if (error instanceof RequestNotFoundError) return new ApiError(404, "not_found", error.message);
  if (error instanceof RequestStateError) return new ApiError(409, "invalid_state", error.message);
  if (error instanceof RequestFieldError) return new ApiError(400, "invalid_input", error.message, error.fields);
  if (error instanceof IdempotencyConflictError) return new ApiError(422, "idempotency_key_reused", error.message);
  if (error instanceof RequestRefusedError) {
    const reasons = Object.fromEntries(error.report.reasons.map((reason, i) => [`feasibility.${i}`, reason]));
    return new ApiError(422, "refused", error.message, reasons);
  }
  return error;
}
