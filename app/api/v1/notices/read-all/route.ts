import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { markAllNoticesRead } from "@/lib/notices/queries";

export const POST = apiRoute([], async ({ user }) => Response.json({ marked: await markAllNoticesRead(getDb(), user.id) }));
