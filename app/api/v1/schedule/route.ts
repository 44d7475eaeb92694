import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { listCalendarBlocks } from "@/lib/schedule/calendar-queries";
import { scheduleQuerySchema } from "@/lib/schedule/schemas";

// GET /api/v1/schedule?telescope=&from=&to= — every role may read the schedule.
export const GET = apiRoute([], async ({ request }) => {
  const params = Object.fromEntries(new URL(request.url).searchParams);
  const query = scheduleQuerySchema.parse(params);
  const blocks = await listCalendarBlocks(getDb(), { telescopeId: query.telescope, from: query.from, to: query.to });
  return Response.json({ from: query.from.toISOString(), to: query.to.toISOString(), blocks });
});
