/**
 * Domain errors become HTTP answers here and nowhere else. Every /api/v1 error body is
 * `{ error: { code, message, fields? } }`.
 */
import { ZodError } from "zod";
import { RateLimitedError } from "@/lib/auth/rate-limit";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export function zodFields(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".") || "body";
    fields[key] ??= issue.message;
  }
  return fields;
}

export function errorResponse(error: unknown): Response {
  if (error instanceof ApiError) {
    return Response.json({ error: { code: error.code, message: error.message, fields: error.fields } }, { status: error.status });
  }
  if (error instanceof ZodError) {
    return Response.json(
      { error: { code: "invalid_input", message: "Some fields are not valid.", fields: zodFields(error) } },
      { status: 400 },
    );
  }
  if (error instanceof RateLimitedError) {
    return Response.json(
      { error: { code: "rate_limited", message: error.message } },
      { status: 429, headers: { "Retry-After": String(Math.ceil(error.retryAfterSeconds)) } },
    );
  }
  console.error("unexpected API error", error);
  return Response.json({ error: { code: "internal", message: "Something went wrong on our side." } }, { status: 500 });
}
