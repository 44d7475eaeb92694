import { getDb } from "@/db/index";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, readJson } from "@/lib/api/handler";
import { fileFromApi } from "@/lib/requests/api-filing";
import { toRequestApiError } from "@/lib/requests/api-errors";
import { IDEMPOTENCY_HEADER, idempotencyKeySchema } from "@/lib/requests/idempotency";

// POST /api/v1/too-requests — a PI (or their alert pipeline's token) files a ToO request.
export const POST = apiRoute(["pi"], async ({ request, user }) => {
  const header = request.headers.get(IDEMPOTENCY_HEADER);
  let key: string | null = null;
  if (header !== null) {
    const parsed = idempotencyKeySchema.safeParse(header);
    if (!parsed.success) throw new ApiError(400, "invalid_input", parsed.error.issues[0]?.message ?? "Bad Idempotency-Key.", { [IDEMPOTENCY_HEADER]: parsed.error.issues[0]?.message ?? "" });
    key = parsed.data;
  }
  const body = await readJson(request, 2_000_000);
  const answer = await fileFromApi(getDb(), user, body, key).catch((e: unknown) => {
    throw toRequestApiError(e);
  });
  return Response.json(answer.body, { status: answer.status, headers: answer.replayed ? { "Idempotent-Replayed": "true" } : {} });
});
