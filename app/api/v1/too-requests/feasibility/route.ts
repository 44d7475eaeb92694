import { getDb } from "@/db/index";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, readJson } from "@/lib/api/handler";
import { cachedVisibility } from "@/lib/requests/feasibility/cache";
import { computeFeasibility } from "@/lib/requests/feasibility/compute";
import { findInstrumentOption, listTelescopesForSky } from "@/lib/requests/reference-queries";
import { feasibilityInputSchema } from "@/lib/requests/schemas";

// POST /api/v1/too-requests/feasibility — the live preview: would this request be
// observable, and where? Files nothing. Any signed-in user or token.
export const POST = apiRoute([], async ({ request }) => {
  const input = feasibilityInputSchema.parse(await readJson(request, 2_000_000));
  const db = getDb();
  const [telescopes, instrument] = await Promise.all([
    listTelescopesForSky(db, input.telescopeIds),
    input.instrumentId ? findInstrumentOption(db, input.instrumentId) : Promise.resolve(undefined),
  ]);
  if (telescopes.length !== input.telescopeIds.length) {
    throw new ApiError(400, "invalid_input", "One of the chosen telescopes does not exist.", { telescopeIds: "One of the chosen telescopes does not exist." });
  }
  return Response.json(computeFeasibility(input, telescopes, instrument ?? null, new Date(), { visibility: cachedVisibility }));
});
