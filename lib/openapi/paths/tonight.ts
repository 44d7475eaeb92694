import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { acknowledgeSchema, executionLogSchema, queueQuerySchema } from "@/lib/tonight/schemas";
import { BEARER, errors, json, jsonBody } from "../common";

// Tonight's queue for night assistants. The answers are outlined loosely here; the
// tonight module owns their exact shape.
const telescopeParam = z.object({ id: z.string().meta({ param: { description: "The telescope's id or code, e.g. AQ16." } }) });
const blockParam = z.object({ id: z.uuid().meta({ param: { description: "The block's id." } }) });

export function registerTonightPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/telescopes/{id}/queue",
    tags: ["Tonight"],
    summary: "Tonight's queue for a telescope",
    description: "The night's blocks on the telescope with every change since the schedule was published. Default night: tonight at the site.",
    security: BEARER,
    request: { params: telescopeParam, query: queueQuerySchema },
    responses: { 200: json(z.object({}).loose().meta({ description: "The queue." }), "The queue."), ...errors(400, 403, 404) },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/telescopes/{id}/acknowledgements",
    tags: ["Tonight"],
    summary: "Acknowledge the changes seen so far",
    description: "Roles: night assistant (of this telescope) or admin.",
    security: BEARER,
    request: { params: telescopeParam, body: jsonBody(acknowledgeSchema) },
    responses: { 201: json(z.object({ acknowledgement: z.object({}).loose() }), "Recorded."), ...errors(400, 403, 404, 409) },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/blocks/{id}/executions",
    tags: ["Tonight"],
    summary: "Log what was executed of a block",
    description: "Roles: night assistant (of the block's telescope) or admin.",
    security: BEARER,
    request: { params: blockParam, body: jsonBody(executionLogSchema) },
    responses: { 201: json(z.object({ execution: z.object({}).loose() }), "Logged."), ...errors(400, 403, 404, 409) },
  });
}
