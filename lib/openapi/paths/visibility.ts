import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { visibilityRequestSchema } from "@/lib/visibility";
import { BEARER, errors, json, jsonBody } from "../common";

// computeVisibility's answer is a plain TypeScript type; its outline is described here.
const moment = z.object({ utc: z.string(), local: z.string() });
const visibilityResultSchema = z
  .object({
    site: z.object({ name: z.string().nullable(), latitudeDeg: z.number(), longitudeDeg: z.number(), heightM: z.number(), timeZone: z.string() }),
    target: z.object({ kind: z.enum(["fixed", "ephemeris"]), name: z.string().nullable(), ra: z.string().nullable(), dec: z.string().nullable() }).loose(),
    limits: z.object({ minAltitudeDeg: z.number(), maxAirmass: z.number().nullable(), darkness: z.string(), sunAvoidanceDeg: z.number() }),
    nights: z.array(
      z
        .object({
          nightOf: z.string(),
          windows: z.array(z.object({ start: moment, end: moment, durationMinutes: z.number(), bestAltitudeDeg: z.number(), bestAirmass: z.number().nullable() }).loose()),
          observableMinutes: z.number(),
          sunAvoidance: z.object({ status: z.enum(["clear", "restricted", "refused"]), reason: z.string() }).loose(),
        })
        .loose(),
    ),
    summary: z.object({ nights: z.number(), nightsWithWindows: z.number(), observableMinutes: z.number() }).loose(),
    sunAvoidance: z.object({ status: z.enum(["clear", "restricted", "refused"]), reason: z.string() }),
    curve: z.unknown().meta({ description: "Airmass chart samples, single-night requests only (else null)." }),
    fading: z.unknown().meta({ description: "The fading clock for moving targets with H or magnitudes (else null)." }),
    conventions: z.record(z.string(), z.string()),
    disclaimer: z.string(),
  })
  .meta({ id: "VisibilityResult" });

export function registerVisibilityPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "post",
    path: "/api/v1/visibility",
    tags: ["Sky"],
    summary: "Observable windows for a target from a site",
    description: "Twilight, airmass, Moon and sun avoidance for a fixed or moving target over one night or a range of nights. Any signed-in user or token. A planning aid.",
    security: BEARER,
    request: { body: jsonBody(visibilityRequestSchema.meta({ id: "VisibilityRequest" })) },
    responses: { 200: json(visibilityResultSchema, "Windows per night, with the sun-avoidance verdict."), ...errors(400, 413) },
  });
}
