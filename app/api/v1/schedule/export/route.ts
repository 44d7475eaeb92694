import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { blocksToCsv } from "@/lib/schedule/export/csv";
import { blocksToIcal } from "@/lib/schedule/export/ical";
import { listBlocksForExport } from "@/lib/schedule/export/queries";
import { exportQuerySchema } from "@/lib/schedule/export/schemas";

// Any signed-in user: the consortium schedule is visible to all its members.
export const GET = apiRoute([], async ({ request }) => {
  const query = exportQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const blocks = await listBlocksForExport(getDb(), {
    telescopeId: query.telescope,
    programId: query.program,
    observerUserId: query.observer,
    from: query.from,
    to: query.to,
  });
  const csv = query.format === "csv";
  return new Response(csv ? blocksToCsv(blocks) : blocksToIcal(blocks, { name: "Nightbreak schedule" }), {
    headers: {
      "Content-Type": csv ? "text/csv; charset=utf-8" : "text/calendar; charset=utf-8",
      "Content-Disposition": `attachment; filename="nightbreak-schedule.${query.format}"`,
      "Cache-Control": "private, no-store",
    },
  });
});
