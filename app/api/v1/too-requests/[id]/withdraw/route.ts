import { getDb } from "@/db/index";
import { ApiError } from "@/lib/api/errors";
import { apiRoute } from "@/lib/api/handler";
import { toRequestApiError } from "@/lib/requests/api-errors";
import { parseRequestId, readApiRequest } from "@/lib/requests/api-read";
import { withdrawSchema } from "@/lib/requests/schemas";
import { withdrawRequest } from "@/lib/requests/service";

type Params = { id: string };

async function optionalJson(request: Request): Promise<unknown> {
  const text = await request.text();
  if (text.length > 100_000) throw new ApiError(413, "too_large", "The body is larger than 100000 bytes.");
  if (text.trim() === "") return {};
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new ApiError(400, "invalid_json", "The body is not valid JSON.");
  }
}

// POST /api/v1/too-requests/{id}/withdraw — the PI withdraws a submitted or in-review
// request. The body is optional: { "note": "…" }.
export const POST = apiRoute<Params>(["pi"], async ({ params, request, user }) => {
  const { note } = withdrawSchema.parse(await optionalJson(request));
  const db = getDb();
  try {
    const id = parseRequestId(params.id);
    await withdrawRequest(db, user, id, note);
    return Response.json({ request: await readApiRequest(db, user, id) });
  } catch (e) {
    throw toRequestApiError(e);
  }
});
