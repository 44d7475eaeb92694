import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import type { LedgerOption } from "@/lib/ledger/queries";

/** Filters live in the URL (a plain GET form), so a filtered ledger can be linked and exported. */
export function LedgerFilters({ semesters, partners, semester, partner }: { semesters: LedgerOption[]; partners: LedgerOption[]; semester?: string; partner?: string }) {
  const params = new URLSearchParams({ format: "csv", ...(semester ? { semester } : {}), ...(partner ? { partner } : {}) });
  return (
    <form method="get" aria-label="Filter the ledger" className="flex flex-wrap items-end gap-3">
      <Field id="ledger-semester" label="Semester">
        <select id="ledger-semester" name="semester" defaultValue={semester ?? ""} className={inputClass}>
          <option value="">All semesters</option>
          {semesters.map((s) => (
            <option key={s.id} value={s.id}>{s.label}</option>
          ))}
        </select>
      </Field>
      <Field id="ledger-partner" label="Partner">
        <select id="ledger-partner" name="partner" defaultValue={partner ?? ""} className={inputClass}>
          <option value="">All partners</option>
          {partners.map((p) => (
            <option key={p.id} value={p.id}>{p.label}</option>
          ))}
        </select>
      </Field>
      <div className="flex gap-2 pb-5">
        <button type="submit" className={buttonClass("quiet")}>Show</button>
        <a href={`/api/v1/ledger?${params.toString()}`} className={buttonClass("quiet")} download>
          Export CSV
        </a>
        {(semester || partner) && <Link href="/ledger" className={buttonClass("quiet")}>Clear filters</Link>}
      </div>
    </form>
  );
}
