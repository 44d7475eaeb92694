/**
 * Server actions answer with an ActionResult: field errors to show beside the fields, or
 * one message. Known domain errors become messages here, in one place.
 */
import { ZodError, type ZodType } from "zod";
import { ForbiddenError } from "@/lib/auth/session";
import { RateLimitedError } from "@/lib/auth/rate-limit";
import { zodFields } from "@/lib/api/errors";

export type ActionResult<T = undefined> =
  | { ok: true; message?: string; data?: T }
  | { ok: false; message: string; fieldErrors?: Record<string, string> };

/** Errors whose message is meant for the person who caused them. */
export class UserFacingError extends Error {}

export function parseOrFail<S extends ZodType>(schema: S, input: unknown): ReturnType<S["parse"]> {
  return schema.parse(input) as ReturnType<S["parse"]>;
}

export async function runAction<T>(work: () => Promise<ActionResult<T>>, knownErrors: Array<new (...args: never[]) => Error> = []): Promise<ActionResult<T>> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof ZodError) return { ok: false, message: "Some fields need attention.", fieldErrors: zodFields(error) };
    if (error instanceof ForbiddenError || error instanceof RateLimitedError || error instanceof UserFacingError) {
      return { ok: false, message: error.message };
    }
    if (error instanceof Error && knownErrors.some((k) => error instanceof k)) return { ok: false, message: error.message };
    throw error;
  }
}
