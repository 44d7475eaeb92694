/**
 * The OpenAPI description of tonight's queue routes. To publish it, add
 * `registerTonightPaths` to PATH_GROUPS in lib/openapi/document.ts.
 */
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { ATTACHMENT_KINDS, BLOCK_KINDS, EXECUTION_OUTCOMES, REQUEST_STATES, SCHEDULE_CHANGE_KINDS, TARGET_KINDS } from "@/db/types";
import { BEARER, errors, json, jsonBody } from "@/lib/openapi/common";
import type { Assert, Same } from "@/lib/openapi/same-shape";
import { TWILIGHT_LEVELS } from "@/lib/schedule/twilight-bands";
import { acknowledgeSchema, executionLogSchema, queueQuerySchema } from "./schemas";
import type { LoggedExecution } from "./execution-log";
import { BLOCK_STATES, ON_SKY_LIMITS, type QueueAcknowledgement, type TonightQueue } from "./types";

const instant = z.string().meta({ format: "date-time" });
const maybeInstant = instant.nullable();

const acknowledgementSchema = z.object({ userName: z.string(), at: instant, throughChangeId: z.number().int() }).meta({ id: "QueueAcknowledgement" });

const queueSchema = z
  .object({
    telescope: z.object({
      id: z.uuid(),
      code: z.string(),
      name: z.string(),
      siteName: z.string(),
      timeZone: z.string(),
      maxAirmass: z.number(),
      minAltitudeDeg: z.number(),
    }),
    night: z.object({
      nightOf: z.string().meta({ description: "The local date on which the night begins at the site." }),
      start: instant,
      end: instant,
      sunset: maybeInstant,
      civilDusk: maybeInstant,
      nauticalDusk: maybeInstant,
      astronomicalDusk: maybeInstant,
      astronomicalDawn: maybeInstant,
      nauticalDawn: maybeInstant,
      civilDawn: maybeInstant,
      sunrise: maybeInstant,
      bands: z.array(z.object({ level: z.enum(TWILIGHT_LEVELS), start: instant, end: instant })),
    }),
    now: instant,
    blocks: z.array(
      z.object({
        id: z.uuid(),
        kind: z.enum(BLOCK_KINDS),
        startsAt: instant,
        endsAt: instant,
        state: z.enum(BLOCK_STATES),
        programCode: z.string(),
        programTitle: z.string(),
        observerName: z.string().nullable(),
        instrumentCode: z.string().nullable(),
        instrumentName: z.string().nullable(),
        changed: z.boolean().meta({ description: "An unacknowledged change names this block or its ToO request." }),
        too: z
          .object({
            requestId: z.uuid(),
            requestState: z.enum(REQUEST_STATES),
            targetName: z.string(),
            target: z.object({
              kind: z.enum(TARGET_KINDS),
              raDeg: z.number().nullable(),
              decDeg: z.number().nullable(),
              raText: z.string(),
              decText: z.string(),
              ephemerisRows: z.number().int(),
            }),
            justification: z.string(),
            justificationSummary: z.string(),
            attachments: z.array(z.object({ id: z.uuid(), kind: z.enum(ATTACHMENT_KINDS), fileName: z.string(), sizeBytes: z.number().int(), url: z.string() })),
          })
          .nullable(),
        execution: z
          .object({ outcome: z.enum(EXECUTION_OUTCOMES), minutesUsed: z.number().nullable(), note: z.string(), loggedByName: z.string(), loggedAt: instant })
          .nullable(),
        onSky: z
          .object({
            altitudeDeg: z.number(),
            airmass: z.number().nullable(),
            limit: z.enum(ON_SKY_LIMITS),
            until: instant,
            minutesLeft: z.number().int(),
            beyondLimitNow: z.boolean(),
          })
          .nullable()
          .meta({ description: "For the block on sky with a known target: planning figures, not a safety system." }),
      }),
    ),
    changes: z.object({
      basis: z.enum(["mine", "telescope"]),
      items: z.array(
        z.object({
          id: z.number().int(),
          kind: z.enum(SCHEDULE_CHANGE_KINDS),
          at: instant,
          startsAt: instant,
          endsAt: instant,
          summary: z.string(),
          blockId: z.uuid().nullable(),
          requestId: z.uuid().nullable(),
          targetName: z.string().nullable(),
        }),
      ),
      more: z.number().int(),
      throughChangeId: z.number().int().nullable(),
    }),
    acknowledgements: z.object({ mine: acknowledgementSchema.nullable(), recent: z.array(acknowledgementSchema) }),
    permissions: z.object({ canAcknowledge: z.boolean(), canLog: z.boolean() }),
  })
  .meta({ id: "TonightQueue" });

const loggedSchema = z.object({
  id: z.uuid(),
  blockId: z.uuid(),
  loggedAt: instant,
  request: z.object({ id: z.uuid(), from: z.enum(REQUEST_STATES), to: z.enum(REQUEST_STATES) }).nullable(),
});

// Compile-time checks that the documented shapes are the ones the handlers return.
export type Checks = [
  Assert<Same<z.infer<typeof queueSchema>, TonightQueue>>,
  Assert<Same<z.infer<typeof acknowledgementSchema>, QueueAcknowledgement>>,
  Assert<Same<z.infer<typeof loggedSchema>, LoggedExecution>>,
];

const telescopeParams = z.object({ id: z.string().meta({ param: { description: "The telescope's id or code (e.g. AQ41)." } }) });
const blockParams = z.object({ id: z.uuid().meta({ param: { description: "The block's id." } }) });

export function registerTonightPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/telescopes/{id}/queue",
    tags: ["Tonight"],
    summary: "Tonight's queue for a telescope",
    description:
      "Roles: night assistant, director, observer, admin. The night (default: tonight at the site) runs from local noon to local noon and is named by the local date on which it begins. " +
      "Blocks come in time order with their state; changes are those after the caller's last acknowledgement (or, for callers who cannot acknowledge, after any night assistant's). " +
      "Feasibility figures are planning aids; opening, pointing and closing the telescope follow the observatory's own procedures and safety rules.",
    security: BEARER,
    request: { params: telescopeParams, query: queueQuerySchema },
    responses: { 200: json(queueSchema, "The queue."), ...errors(400, 403, 404) },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/telescopes/{id}/acknowledgements",
    tags: ["Tonight"],
    summary: "Acknowledge the telescope's changes up to one",
    description: "Roles: the telescope's night assistants, and admins. Name the newest change you have seen; later ones stay unacknowledged.",
    security: BEARER,
    request: { params: telescopeParams, body: jsonBody(acknowledgeSchema) },
    responses: { 201: json(z.object({ acknowledgement: acknowledgementSchema }), "Recorded (or already covered)."), ...errors(400, 403, 404) },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/blocks/{id}/executions",
    tags: ["Tonight"],
    summary: "Log what happened to a block",
    description:
      "Roles: the telescope's night assistants, and admins. `partial` needs `minutesUsed`. For a ToO block the request becomes executed, partially executed or not executed. A later log corrects an earlier one.",
    security: BEARER,
    request: { params: blockParams, body: jsonBody(executionLogSchema) },
    responses: { 201: json(z.object({ execution: loggedSchema }), "Logged."), ...errors(400, 403, 404) },
  });
}
