import { getDb } from "@/db/index";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, readJson } from "@/lib/api/handler";
import { previewReportJson } from "@/lib/requests/feasibility/preview-pool";
import { previewReference } from "@/lib/requests/feasibility/reference-cache";
import { feasibilityInputSchema } from "@/lib/requests/schemas";

// POST /api/v1/too-requests/feasibility — the live preview: would this request be
// observable, and where? Files nothing. Any signed-in user or token.
export const POST = apiRoute([], async ({ request }) => {
  const input = feasibilityInputSchema.parse(await readJson(request, 2_000_000));
  const { telescopes, instrument } = await previewReference(getDb(), input.telescopeIds, input.instrumentId);
  const known = telescopes.filter((t) => t !== undefined);
  if (known.length !== input.telescopeIds.length) {
    throw new ApiError(400, "invalid_input", "One of the chosen telescopes does not exist.", { telescopeIds: "One of the chosen telescopes does not exist." });
  }
  const json = await previewReportJson(input, known, instrument ?? null, new Date());
  return new Response(json, { headers: { "content-type": "application/json" } });
});
