import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { BLOCK_KINDS } from "@/db/types";
import type { BlockDetail, CalendarBlock, CalendarTelescope } from "@/lib/schedule/calendar-queries";
import { exportQuerySchema } from "@/lib/schedule/export/schemas";
import { blockInputSchema, blockPatchSchema, scheduleQuerySchema } from "@/lib/schedule/schemas";
import { BEARER, errors, json, jsonBody, uuidParams } from "../common";
import type { Assert, Same } from "../same-shape";

const instant = z.string().meta({ format: "date-time" });

const calendarBlockSchema = z
  .object({
    id: z.uuid(),
    kind: z.enum(BLOCK_KINDS),
    startsAt: instant,
    endsAt: instant,
    telescopeId: z.uuid(),
    programId: z.uuid(),
    programCode: z.string(),
    programTitle: z.string(),
    piName: z.string(),
    observerUserId: z.uuid().nullable(),
    observerName: z.string().nullable(),
    instrumentId: z.uuid().nullable(),
    instrumentCode: z.string().nullable(),
  })
  .meta({ id: "CalendarBlock" });

const blockDetailSchema = calendarBlockSchema
  .extend({
    telescopeName: z.string(),
    siteName: z.string(),
    timeZone: z.string(),
    instrumentName: z.string().nullable(),
    notes: z.string(),
    history: z.array(z.object({ at: instant, action: z.string(), actorName: z.string().nullable(), details: z.unknown() })),
  })
  .meta({ id: "BlockDetail" });

const telescopeSchema = z
  .object({
    id: z.uuid(),
    code: z.string(),
    name: z.string(),
    siteId: z.uuid(),
    siteName: z.string(),
    timeZone: z.string(),
    latitudeDeg: z.number(),
    longitudeDeg: z.number(),
    heightM: z.number(),
  })
  .meta({ id: "Telescope" });

// Compile-time checks that the documented shapes are the ones the handlers return.
export type Checks = [
  Assert<Same<z.infer<typeof calendarBlockSchema>, CalendarBlock>>,
  Assert<Same<z.infer<typeof blockDetailSchema>, BlockDetail>>,
  Assert<Same<z.infer<typeof telescopeSchema>, CalendarTelescope>>,
];

export function registerSchedulePaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/schedule",
    tags: ["Schedule"],
    summary: "Blocks in a time range",
    description: "Every signed-in user may read the consortium schedule.",
    security: BEARER,
    request: { query: scheduleQuerySchema },
    responses: { 200: json(z.object({ from: instant, to: instant, blocks: z.array(calendarBlockSchema) }), "The blocks."), ...errors(400) },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/schedule/export",
    tags: ["Schedule"],
    summary: "Export the schedule as CSV or iCalendar",
    security: BEARER,
    request: { query: exportQuerySchema },
    responses: {
      200: { description: "The file.", content: { "text/csv": { schema: z.string() }, "text/calendar": { schema: z.string() } } },
      ...errors(400),
    },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/telescopes",
    tags: ["Schedule"],
    summary: "Telescopes with their sites",
    security: BEARER,
    responses: { 200: json(z.object({ telescopes: z.array(telescopeSchema) }), "The telescopes.") },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/blocks",
    tags: ["Schedule"],
    summary: "Create a block",
    description: "Role: admin. Blocks on one telescope never overlap (409 names the block in the way).",
    security: BEARER,
    request: { body: jsonBody(blockInputSchema) },
    responses: { 201: json(z.object({ id: z.uuid() }), "Created."), ...errors(400, 403, 409) },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/blocks/{id}",
    tags: ["Schedule"],
    summary: "A block with its history",
    security: BEARER,
    request: { params: uuidParams },
    responses: { 200: json(z.object({ block: blockDetailSchema }), "The block."), ...errors(404) },
  });
  registry.registerPath({
    method: "patch",
    path: "/api/v1/blocks/{id}",
    tags: ["Schedule"],
    summary: "Move, resize or edit a block",
    description: "Role: admin. Any subset of the block's fields.",
    security: BEARER,
    request: { params: uuidParams, body: jsonBody(blockPatchSchema) },
    responses: { 200: json(z.object({ block: blockDetailSchema }), "The block as saved."), ...errors(400, 403, 404, 409) },
  });
  registry.registerPath({
    method: "delete",
    path: "/api/v1/blocks/{id}",
    tags: ["Schedule"],
    summary: "Delete a block",
    description: "Role: admin.",
    security: BEARER,
    request: { params: uuidParams },
    responses: { 204: { description: "Deleted." }, ...errors(403, 404) },
  });
}
