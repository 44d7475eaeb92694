import { getDb } from "@/db/index";
import { ApiError } from "@/lib/api/errors";
import { apiRoute } from "@/lib/api/handler";
import { impactJson } from "@/lib/impact/json";
import { impactQuerySchema } from "@/lib/impact/schemas";
import { getSlotImpact, UnknownTelescopeError } from "@/lib/impact/service";

// GET /api/v1/impact?telescope=&start=&end= — what an override in this slot would displace (read-only).
export const GET = apiRoute(["director", "admin"], async ({ request }) => {
  const query = impactQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  try {
    return Response.json({ impact: impactJson(await getSlotImpact(getDb(), query)) });
  } catch (e) {
    if (e instanceof UnknownTelescopeError) throw new ApiError(404, "not_found", e.message, { telescope: e.message });
    throw e;
  }
});
