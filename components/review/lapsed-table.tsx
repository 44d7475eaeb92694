import type { LapsedItem } from "@/lib/review/queue";
import { RequestSummaryTable } from "./request-summary-table";

/** Requests whose deadline passed before a decision: no longer waiting, kept in view for a week. */
export function LapsedTable({ items, days }: { items: LapsedItem[]; days: number }) {
  return (
    <section aria-labelledby="lapsed-heading" className="mt-8 flex flex-col gap-2">
      <h2 id="lapsed-heading" className="font-semibold">Lapsed without a decision</h2>
      <p className="text-xs text-muted">Deadline passed in the last {days} days before anyone decided; the PI has been told. Latest deadline first.</p>
      <RequestSummaryTable rows={items.map((r) => ({ ...r, state: "lapsed" as const }))} caption="Requests that lapsed at their deadline without a decision" />
    </section>
  );
}
