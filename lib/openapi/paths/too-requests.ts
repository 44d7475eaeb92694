import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { apiRequestSchema } from "@/lib/requests/api-shape";
import { feasibilityReportSchema } from "@/lib/requests/feasibility/types";
import { feasibilityInputSchema, requestSchema, withdrawSchema } from "@/lib/requests/schemas";
import { BEARER, errors, json, jsonBody, uuidParams } from "../common";

const requestEnvelope = z.object({ request: apiRequestSchema });

export function registerTooRequestPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "post",
    path: "/api/v1/too-requests",
    tags: ["ToO requests"],
    summary: "File a ToO request",
    description:
      "Validates, checks feasibility (sun avoidance and an observable window of the requested length before the deadline on the acceptable telescopes) and files the request. " +
      "Send an Idempotency-Key so a retried trigger never files twice: the same key with the same body answers the first response again; with a different body it is refused (422). " +
      "Times without a zone are UT. Role: pi.",
    security: BEARER,
    request: {
      headers: z.object({
        "Idempotency-Key": z.string().max(255).optional().meta({ param: { description: "Printable ASCII, at most 255 characters, unique per request you mean to file." } }),
      }),
      body: jsonBody(requestSchema.meta({ id: "TooRequestInput" }), "The request. RA/Dec as text in any usual form or as degrees."),
    },
    responses: {
      201: json(requestEnvelope, "Filed. Replays of the same key answer the same body with `Idempotent-Replayed: true`."),
      ...errors(400, 403, 413, 422, 429),
    },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/too-requests/feasibility",
    tags: ["ToO requests"],
    summary: "Preview a request's feasibility",
    description: "Observable windows per telescope inside the request's window, the airmass curves of the first nights, the fading clock and the verdict. Files nothing. A planning aid.",
    security: BEARER,
    request: { body: jsonBody(feasibilityInputSchema.meta({ id: "FeasibilityInput" })) },
    responses: { 200: json(feasibilityReportSchema, "The feasibility report."), ...errors(400, 413) },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/too-requests/{id}",
    tags: ["ToO requests"],
    summary: "Read a request",
    description: "A PI reads their own requests; a director reads any filed request. With state history and attachments.",
    security: BEARER,
    request: { params: uuidParams },
    responses: { 200: json(requestEnvelope, "The request."), ...errors(403, 404) },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/too-requests/{id}/withdraw",
    tags: ["ToO requests"],
    summary: "Withdraw a request",
    description: "The PI withdraws a submitted or in-review request; a decided or lapsed one answers 409. The body is optional.",
    security: BEARER,
    request: { params: uuidParams, body: { required: false, content: { "application/json": { schema: withdrawSchema } } } },
    responses: { 200: json(requestEnvelope, "The withdrawn request."), ...errors(400, 403, 404, 409) },
  });
}
