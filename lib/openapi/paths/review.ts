import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { impactQuerySchema } from "@/lib/impact/schemas";
import { ledgerQuerySchema } from "@/lib/ledger/schemas";
import { decisionSchema } from "@/lib/review/schemas";
import { BEARER, errors, json, jsonBody, uuidParams } from "../common";

// The director's side: impact of a slot, the decision, the time-owed ledger. Answers are
// outlined loosely here; their modules own the exact shapes.
export function registerReviewPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/impact",
    tags: ["Review"],
    summary: "What an override in a slot would displace",
    description: "Roles: director, admin. Read-only.",
    security: BEARER,
    request: { query: impactQuerySchema },
    responses: { 200: json(z.object({ impact: z.object({}).loose() }), "Blocks overlapped, displaced minutes per program and observer."), ...errors(400, 403, 404) },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/too-requests/{id}/decision",
    tags: ["Review"],
    summary: "Decide a request",
    description: "Role: director. Approve a slot, decline (reason required) or return to the PI (note required). A slot taken meanwhile answers 409 with its fresh impact.",
    security: BEARER,
    request: { params: uuidParams, body: jsonBody(decisionSchema) },
    responses: { 200: json(z.object({ requestId: z.uuid() }).loose(), "The outcome."), ...errors(400, 403, 404, 409) },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/ledger",
    tags: ["Ledger"],
    summary: "Time charged, credited, repaid and owed",
    description: "Directors and admins see every program; PIs and observers their own. `format=csv` answers a CSV file.",
    security: BEARER,
    request: { query: ledgerQuerySchema },
    responses: {
      200: { description: "The ledger.", content: { "application/json": { schema: z.object({}).loose() }, "text/csv": { schema: z.string() } } },
      ...errors(400, 403),
    },
  });
}
