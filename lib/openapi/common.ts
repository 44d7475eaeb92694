/**
 * Shared pieces of the OpenAPI document: the error body every /api/v1 route answers with,
 * bearer-token security, and small helpers so each path file reads like the route it
 * describes.
 */
import type { OpenAPIRegistry, ResponseConfig } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";

export const errorSchema = z
  .object({
    error: z.object({
      code: z.string().meta({ example: "invalid_input" }),
      message: z.string(),
      fields: z.record(z.string(), z.string()).optional().meta({ description: "One message per field path, e.g. \"target.ra\"." }),
    }),
  })
  .meta({ id: "Error" });

export const uuidParams = z.object({ id: z.uuid().meta({ param: { description: "The record's id." } }) });

export function json(schema: z.ZodType, description: string): ResponseConfig {
  return { description, content: { "application/json": { schema } } };
}

export function jsonBody(schema: z.ZodType, description?: string) {
  return { required: true, description, content: { "application/json": { schema } } };
}

const errorResponse = (description: string) => json(errorSchema, description);

/** The answers every authenticated route may give besides its own. */
export function errors(...statuses: (400 | 401 | 403 | 404 | 409 | 413 | 422 | 429)[]): Record<number, ResponseConfig> {
  const text: Record<number, string> = {
    400: "Invalid input: `fields` says what is wrong with each field.",
    401: "No session and no API token, or the token is unknown or revoked.",
    403: "Your roles do not allow this.",
    404: "Not found (or not yours to see).",
    409: "The record is not in a state that allows this.",
    413: "The body is too large.",
    422: "Understood but refused; the message says why.",
    429: "Too many attempts; see Retry-After.",
  };
  return Object.fromEntries([401, ...statuses].map((s) => [s, errorResponse(text[s] ?? "Error")]));
}

export const BEARER: Record<string, string[]>[] = [{ bearerAuth: [] }, { sessionCookie: [] }];

export function registerSecurity(registry: OpenAPIRegistry): void {
  registry.registerComponent("securitySchemes", "bearerAuth", {
    type: "http",
    scheme: "bearer",
    description: "A personal API token (Settings → API tokens). It carries its owner's roles.",
  });
  registry.registerComponent("securitySchemes", "sessionCookie", {
    type: "apiKey",
    in: "cookie",
    name: "next-auth.session-token",
    description: "The browser session of a signed-in person.",
  });
}
