import { buildOpenApiDocument } from "@/lib/openapi/document";

// GET /api/v1/openapi.json — public: it describes the API, it holds no data.
export function GET(): Response {
  return Response.json(buildOpenApiDocument(), { headers: { "Cache-Control": "public, max-age=300" } });
}
