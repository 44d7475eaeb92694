import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { listCalendarBlocks } from "@/lib/schedule/calendar-queries";
import { answerResponse, cachedSchedule } from "@/lib/schedule/schedule-cache";
import { scheduleQuerySchema } from "@/lib/schedule/schemas";

// GET /api/v1/schedule?telescope=&from=&to= — every role may read the schedule.
export const GET = apiRoute([], async ({ request }) => {
  const params = Object.fromEntries(new URL(request.url).searchParams);
  const query = scheduleQuerySchema.parse(params);
  const db = getDb();
  const key = `${query.telescope ?? "*"}|${query.from.toISOString()}|${query.to.toISOString()}`;
  const answer = await cachedSchedule(db, key, async () => {
    const blocks = await listCalendarBlocks(db, { telescopeId: query.telescope, from: query.from, to: query.to });
    return JSON.stringify({ from: query.from.toISOString(), to: query.to.toISOString(), blocks });
  });
  return answerResponse(answer, { "content-type": "application/json", "cache-control": "private, no-cache" });
});
