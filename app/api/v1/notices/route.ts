import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { countUnreadNotices, listNoticesForUser } from "@/lib/notices/queries";
import { listNoticesQuerySchema } from "@/lib/notices/schemas";

// The signed-in user's own notices, newest first.
export const GET = apiRoute([], async ({ request, user }) => {
  const query = listNoticesQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const [notices, unread] = await Promise.all([
    listNoticesForUser(getDb(), user.id, { limit: query.limit, unreadOnly: query.unread }),
    countUnreadNotices(getDb(), user.id),
  ]);
  return Response.json({ notices, unread }, { headers: { "Cache-Control": "no-store" } });
});
