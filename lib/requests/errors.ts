/**
 * The request service's refusals. They extend UserFacingError, so server actions show
 * their message as it is; lib/requests/api-errors.ts turns them into HTTP answers.
 */
import { UserFacingError } from "@/lib/actions/result";
import type { FeasibilityReport } from "./feasibility/types";

export class RequestNotFoundError extends UserFacingError {
  constructor() {
    super("That request does not exist, or it is not yours to see.");
  }
}

/** The request is not in a state that allows this (editing a filed request, withdrawing twice…). */
export class RequestStateError extends UserFacingError {}

/** A reference that does not hold: a program that is not the PI's ToO program, an unknown telescope… */
export class RequestFieldError extends UserFacingError {
  constructor(readonly fields: Record<string, string>) {
    super(Object.values(fields)[0] ?? "Some fields need attention.");
  }
}

/** Feasibility says no: sun avoidance is broken, or there is no observable window before the deadline. */
export class RequestRefusedError extends UserFacingError {
  constructor(readonly report: FeasibilityReport) {
    super(`Not filed. ${report.reasons.join(" ")}`);
  }
}

export class IdempotencyConflictError extends UserFacingError {
  constructor() {
    super("This Idempotency-Key was already used with a different request body. Use a new key for a new request.");
  }
}
