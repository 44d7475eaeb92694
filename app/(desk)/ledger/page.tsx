import type { Metadata } from "next";
import { z } from "zod";
import { getDb } from "@/db/index";
import { LedgerFilters } from "@/components/ledger/ledger-filters";
import { PaybackForm } from "@/components/ledger/payback-form";
import { ProgramBalancesTable } from "@/components/ledger/program-balances-table";
import { TotalsTable } from "@/components/ledger/totals-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { listLedgerFilterOptions } from "@/lib/ledger/queries";
import { getLedger, mayScheduleTheLedger } from "@/lib/ledger/service";
import { listCalendarTelescopes } from "@/lib/schedule/calendar-queries";
import { formatDuration } from "@/lib/time/format";
import { schedulePaybackAction } from "./actions";

export const metadata: Metadata = { title: "Time-owed ledger" };

const id = z.uuid().optional().catch(undefined);

export default async function LedgerPage({ searchParams }: { searchParams: Promise<{ semester?: string; partner?: string }> }) {
  const user = await requirePageRole("director", "admin", "pi", "observer");
  const params = await searchParams;
  const semester = id.parse(params.semester);
  const partner = id.parse(params.partner);
  const db = getDb();
  const [ledger, options] = await Promise.all([getLedger(db, user, { semesterId: semester, partnerId: partner }), listLedgerFilterOptions(db)]);
  const canSchedule = mayScheduleTheLedger(user);
  const telescopes = canSchedule ? await listCalendarTelescopes(db) : [];
  const owed = ledger.programs.filter((p) => p.owedMinutes > 0);

  return (
    <>
      <PageHeader title="Time-owed ledger">
        <p className="text-xs text-muted">
          {ledger.scope === "all" ? "Every program." : "Your programs."} Displaced time is credited {ledger.creditRatio}:1 (the consortium's policy).
        </p>
      </PageHeader>
      <div className="flex flex-col gap-6">
        <LedgerFilters semesters={options.semesters} partners={options.partners} semester={semester} partner={partner} />
        <ProgramBalancesTable programs={ledger.programs} />
        {ledger.programs.length > 0 && (
          <div className="grid gap-4 lg:grid-cols-2">
            <TotalsTable
              caption="Per partner"
              rows={ledger.partners.map((p) => ({ ...p, key: `${p.semesterId}:${p.partnerId}`, label: `${p.partnerCode} · ${p.semesterCode}` }))}
            />
            <TotalsTable caption="Per semester" rows={ledger.semesters.map((s) => ({ ...s, key: s.semesterId, label: s.semesterCode }))} total={ledger.totals} />
          </div>
        )}
        {canSchedule && (
          <section aria-labelledby="payback-heading" className="flex flex-col gap-3 rounded-lg border border-line bg-raised p-4">
            <h2 id="payback-heading" className="font-semibold">Pay back owed time</h2>
            <PaybackForm
              programs={owed.map((p) => ({ value: p.programId, label: `${p.programCode} (${p.semesterCode}) — owed ${formatDuration(p.owedMinutes)}` }))}
              telescopes={telescopes.map((t) => ({ value: t.id, label: `${t.code} — ${t.name}` }))}
              action={schedulePaybackAction}
            />
          </section>
        )}
      </div>
    </>
  );
}
