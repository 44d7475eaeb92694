import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { countUnreadNotices } from "@/lib/notices/queries";

// Polled by the bell in the header.
export const GET = apiRoute([], async ({ user }) =>
  Response.json({ unread: await countUnreadNotices(getDb(), user.id) }, { headers: { "Cache-Control": "no-store" } }),
);
