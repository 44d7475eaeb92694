import { ApiError } from "@/lib/api/errors";
import { BlockConflictError, BlockNotFoundError, InstrumentMismatchError } from "./service";

/** The schedule's domain errors as HTTP answers (used by the block route handlers). */
export function toScheduleApiError(error: unknown): unknown {
  if (error instanceof BlockConflictError) return new ApiError(409, "overlap", error.message);
  if (error instanceof BlockNotFoundError) return new ApiError(404, "not_found", error.message);
  if (error instanceof InstrumentMismatchError) return new ApiError(400, "invalid_input", error.message, { instrumentId: error.message });
  if (error instanceof RangeError) return new ApiError(400, "invalid_input", error.message, { endsAt: error.message });
  if ((error as { code?: string } | null)?.code === "23503") return new ApiError(400, "invalid_input", "A telescope, program, observer or instrument given does not exist.");
  return error;
}
