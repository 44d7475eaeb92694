import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { NOTICE_EVENTS } from "@/db/types";
import { emailPreferencesSchema, listNoticesQuerySchema } from "@/lib/notices/schemas";
import { BEARER, errors, json, jsonBody, uuidParams } from "../common";

const noticeSchema = z
  .object({
    id: z.uuid(),
    event: z.enum(NOTICE_EVENTS),
    title: z.string(),
    body: z.string(),
    link: z.string().meta({ description: "A path in the app, e.g. /review/{id}." }),
    createdAt: z.string().meta({ format: "date-time" }),
    readAt: z.string().meta({ format: "date-time" }).nullable(),
  })
  .meta({ id: "Notice" });

const preferences = z.object({ email: z.record(z.enum(NOTICE_EVENTS), z.boolean()) });

export function registerNoticePaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/notices",
    tags: ["Notices"],
    summary: "Your notices, newest first",
    security: BEARER,
    request: { query: listNoticesQuerySchema },
    responses: { 200: json(z.object({ notices: z.array(noticeSchema), unread: z.number().int() }), "Your notices."), ...errors(400) },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/notices/unread-count",
    tags: ["Notices"],
    summary: "How many of your notices are unread",
    security: BEARER,
    responses: { 200: json(z.object({ unread: z.number().int() }), "The count.") },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/notices/{id}/read",
    tags: ["Notices"],
    summary: "Mark one of your notices read",
    security: BEARER,
    request: { params: uuidParams },
    responses: { 204: { description: "Marked." }, ...errors(404) },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/notices/read-all",
    tags: ["Notices"],
    summary: "Mark all your notices read",
    security: BEARER,
    responses: { 200: json(z.object({ marked: z.number().int() }), "How many were marked.") },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/notices/preferences",
    tags: ["Notices"],
    summary: "Which events reach you by e-mail",
    security: BEARER,
    responses: { 200: json(preferences, "Per event, e-mail on or off (in-app notices always arrive).") },
  });
  registry.registerPath({
    method: "put",
    path: "/api/v1/notices/preferences",
    tags: ["Notices"],
    summary: "Change which events reach you by e-mail",
    security: BEARER,
    request: { body: jsonBody(z.object({ email: emailPreferencesSchema })) },
    responses: { 200: json(preferences, "The preferences as saved."), ...errors(400) },
  });
}
