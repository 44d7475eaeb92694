import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { ROLES } from "@/db/types";
import type { User } from "@/lib/users/queries";
import { createUserSchema } from "@/lib/users/schemas";
import { BEARER, errors, json, jsonBody } from "../common";
import type { Assert, Same } from "../same-shape";

const userSchema = z
  .object({ id: z.uuid(), email: z.string(), name: z.string(), roles: z.array(z.enum(ROLES)), disabled: z.boolean() })
  .meta({ id: "User" });

export type Checks = [Assert<Same<z.infer<typeof userSchema>, User>>];

export function registerAdminUserPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/admin/users",
    tags: ["Administration"],
    summary: "Every user with their roles",
    description: "Role: admin.",
    security: BEARER,
    responses: { 200: json(z.object({ users: z.array(userSchema) }), "The users."), ...errors(403) },
  });
  registry.registerPath({
    method: "post",
    path: "/api/v1/admin/users",
    tags: ["Administration"],
    summary: "Create a user",
    description: "Role: admin.",
    security: BEARER,
    request: { body: jsonBody(createUserSchema) },
    responses: { 201: json(z.object({ id: z.uuid() }), "Created."), ...errors(400, 403, 409) },
  });
}
