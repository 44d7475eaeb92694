import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { QUEUE_VIEW_ROLES } from "@/lib/tonight/access";
import { toTonightApiError } from "@/lib/tonight/errors";
import { getTonightQueue } from "@/lib/tonight/queue";
import { queueQuerySchema, telescopeRefSchema } from "@/lib/tonight/schemas";

// GET ?night=YYYY-MM-DD (default: tonight at the site). [id] is the telescope's uuid or code.
export const GET = apiRoute<{ id: string }>(QUEUE_VIEW_ROLES, async ({ request, user, params }) => {
  const ref = telescopeRefSchema.parse(params.id);
  const { night } = queueQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  // Every open page polls this: a night snapshot up to a second old is shared between them.
  const queue = await getTonightQueue(getDb(), user, ref, night, new Date(), { maxAgeMs: 1000 }).catch((e: unknown) => {
    throw toTonightApiError(e);
  });
  return Response.json(queue, { headers: { "cache-control": "no-store" } });
});
