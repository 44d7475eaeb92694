import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { listCalendarTelescopes } from "@/lib/schedule/calendar-queries";

export const GET = apiRoute([], async () => Response.json({ telescopes: await listCalendarTelescopes(getDb()) }));
