/**
 * The OpenAPI document of /api/v1, generated from the routes' zod schemas. Each area
 * registers its paths in lib/openapi/paths/<area>.ts; to document a new route, add it
 * there (or add a file and one line to PATH_GROUPS). tests/unit/openapi checks that every
 * route.ts under app/api/v1 appears in the document.
 */
import { OpenApiGeneratorV31, OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { registerSecurity } from "./common";
import { registerAdminUserPaths } from "./paths/admin-users";
import { registerNoticePaths } from "./paths/notices";
import { registerDecisionLedgerPaths } from "./paths/decisions-ledger";
import { registerSchedulePaths } from "./paths/schedule";
import { registerTonightPaths } from "@/lib/tonight/openapi";
import { registerTooRequestPaths } from "./paths/too-requests";
import { registerVisibilityPaths } from "./paths/visibility";

const PATH_GROUPS: ((registry: OpenAPIRegistry) => void)[] = [
  registerTooRequestPaths,
  registerVisibilityPaths,
  registerSchedulePaths,
  registerAdminUserPaths,
  registerNoticePaths,
  registerTonightPaths,
  registerDecisionLedgerPaths,
];

type Document = ReturnType<OpenApiGeneratorV31["generateDocument"]>;
let cached: Document | undefined;

export function buildOpenApiDocument(): Document {
  if (cached) return cached;
  const registry = new OpenAPIRegistry();
  registerSecurity(registry);
  for (const register of PATH_GROUPS) register(registry);
  registry.registerPath({
    method: "get",
    path: "/api/v1/openapi.json",
    tags: ["Meta"],
    summary: "This document",
    responses: { 200: { description: "The OpenAPI 3.1 document of /api/v1." } },
  });
  cached = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Nightbreak machine API",
      version: "1.0.0",
      description:
        "The override desk's API for alert pipelines and scripts. Authenticate with a personal API token (`Authorization: Bearer nbk_…`); it carries its owner's roles. " +
        "JSON in and out; errors are `{ error: { code, message, fields } }`. Feasibility figures are planning aids: the decision to open, point or close a telescope rests with the night assistant and the observatory's own procedures. " +
        "Requests that break a telescope's sun avoidance limit are refused.",
    },
  });
  return cached;
}
