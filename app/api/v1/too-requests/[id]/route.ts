import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { toRequestApiError } from "@/lib/requests/api-errors";
import { parseRequestId, readApiRequest } from "@/lib/requests/api-read";

type Params = { id: string };

// GET /api/v1/too-requests/{id} — the PI's own request, or any filed one for a director.
export const GET = apiRoute<Params>(["pi", "director"], async ({ params, user }) => {
  try {
    return Response.json({ request: await readApiRequest(getDb(), user, parseRequestId(params.id)) });
  } catch (e) {
    throw toRequestApiError(e);
  }
});
