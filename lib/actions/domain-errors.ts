/**
 * Domain errors shared by the reference-data services (sites, telescopes, programs…).
 * They extend UserFacingError, so runAction shows their message as it is.
 */
import { UserFacingError } from "./result";

/** A refusal that belongs beside one form field ("A site with the code AQS already exists."). */
export class FieldError extends UserFacingError {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
  }
}

export class RecordNotFoundError extends UserFacingError {
  constructor(noun: string) {
    super(`That ${noun} no longer exists: someone may have deleted it. Nothing was saved.`);
  }
}

/** Deleting something other records still point at. */
export class RecordInUseError extends UserFacingError {}
