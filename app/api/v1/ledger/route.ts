import { getDb } from "@/db/index";
import { apiRoute } from "@/lib/api/handler";
import { ledgerCsv, ledgerCsvFileName } from "@/lib/ledger/csv";
import { ledgerQuerySchema } from "@/lib/ledger/schemas";
import { getLedger } from "@/lib/ledger/service";

// GET /api/v1/ledger?semester=&partner=&format=csv — time charged, credited, repaid and owed.
// Directors and admins see every program; PIs and observers their own.
export const GET = apiRoute(["director", "admin", "pi", "observer"], async ({ request, user }) => {
  const query = ledgerQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const ledger = await getLedger(getDb(), user, { semesterId: query.semester, partnerId: query.partner });
  if (query.format === "csv") {
    const semester = query.semester ? ledger.semesters.find((s) => s.semesterId === query.semester)?.semesterCode : undefined;
    return new Response(ledgerCsv(ledger.programs), {
      headers: {
        "Content-Type": "text/csv; charset=utf-8",
        "Content-Disposition": `attachment; filename="${ledgerCsvFileName(new Date(), semester)}"`,
        "Cache-Control": "no-store",
      },
    });
  }
  return Response.json(ledger, { headers: { "Cache-Control": "no-store" } });
});
