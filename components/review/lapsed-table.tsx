import Link from "next/link";
import { StateBadge } from "@/components/requests/state-badge";
import type { LapsedItem } from "@/lib/review/queue";
import { formatUt } from "@/lib/time/format";
import { UrgencyBadge } from "./urgency-badge";

/** Requests whose deadline passed before a decision: no longer waiting, kept in view for a week. */
export function LapsedTable({ items, days }: { items: LapsedItem[]; days: number }) {
  return (
    <section aria-labelledby="lapsed-heading" className="mt-8 flex flex-col gap-2">
      <h2 id="lapsed-heading" className="font-semibold">Lapsed without a decision</h2>
      <p className="text-xs text-muted">Deadline passed in the last {days} days before anyone decided; the PI has been told. Latest deadline first.</p>
      <div className="overflow-x-auto rounded-lg border border-line bg-raised">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Requests that lapsed at their deadline without a decision</caption>
          <thead className="bg-sunken text-2xs uppercase tracking-wide text-muted">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">Urgency</th>
              <th scope="col" className="px-3 py-2 font-medium">Target</th>
              <th scope="col" className="px-3 py-2 font-medium">State</th>
              <th scope="col" className="px-3 py-2 font-medium">PI</th>
              <th scope="col" className="px-3 py-2 font-medium">Program</th>
              <th scope="col" className="px-3 py-2 font-medium">Deadline (UT)</th>
            </tr>
          </thead>
          <tbody>
            {items.map((r) => (
              <tr key={r.id} className="border-t border-line align-top">
                <td className="px-3 py-2"><UrgencyBadge urgency={r.urgency} /></td>
                <td className="px-3 py-2">
                  <Link href={`/review/${r.id}`} className="font-medium underline">{r.targetName}</Link>
                  <span className="num block text-2xs text-muted">{r.durationMinutes ?? "?"} min on {r.telescopeCodes.join(", ") || "—"}</span>
                </td>
                <td className="px-3 py-2"><StateBadge state="lapsed" /></td>
                <td className="px-3 py-2">{r.piName}</td>
                <td className="num px-3 py-2">{r.programCode ?? "—"}</td>
                <td className="num px-3 py-2 whitespace-nowrap">{r.deadline ? formatUt(r.deadline) : "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
