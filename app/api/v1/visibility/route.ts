import { ApiError } from "@/lib/api/errors";
import { apiRoute, readJson } from "@/lib/api/handler";
import { computeVisibility, parseVisibilityRequest } from "@/lib/visibility";

// POST /api/v1/visibility — observable windows for a target from a site. Pure computation:
// any signed-in user or token.
export const POST = apiRoute([], async ({ request }) => {
  const parsed = parseVisibilityRequest(await readJson(request, 5_000_000));
  if (!parsed.ok) throw new ApiError(400, "invalid_input", "Some fields are not valid.", parsed.fieldErrors);
  try {
    return Response.json(computeVisibility(parsed.data));
  } catch (error) {
    // The engine's own refusals (a date a site's clocks skipped, …) are the caller's to fix.
    if (error instanceof RangeError) throw new ApiError(400, "invalid_input", error.message);
    throw error;
  }
});
