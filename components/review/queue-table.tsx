import Link from "next/link";
import { StateBadge } from "@/components/requests/state-badge";
import { EmptyState } from "@/components/ui/empty-state";
import type { QueueItem } from "@/lib/review/order";
import { formatUt } from "@/lib/time/format";
import { UrgencyBadge } from "./urgency-badge";

/** The director's queue, most urgent first (the order comes from lib/review/order.ts). */
export function QueueTable({ items }: { items: QueueItem[] }) {
  if (items.length === 0) return <EmptyState>No override requests are waiting for review.</EmptyState>;
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-raised">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Requests waiting for a decision, most urgent first</caption>
        <thead className="bg-sunken text-2xs uppercase tracking-wide text-muted">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">Urgency</th>
            <th scope="col" className="px-3 py-2 font-medium">Target</th>
            <th scope="col" className="px-3 py-2 font-medium">State</th>
            <th scope="col" className="px-3 py-2 font-medium">PI</th>
            <th scope="col" className="px-3 py-2 font-medium">Program</th>
            <th scope="col" className="px-3 py-2 font-medium">Deadline (UT)</th>
            <th scope="col" className="px-3 py-2 font-medium">Feasibility</th>
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
              <td className="px-3 py-2"><StateBadge state={r.state} /></td>
              <td className="px-3 py-2">{r.piName}</td>
              <td className="num px-3 py-2">{r.programCode ?? "—"}</td>
              <td className="num px-3 py-2 whitespace-nowrap">{r.deadline ? formatUt(r.deadline) : "—"}</td>
              <td className="px-3 py-2 text-xs">{r.summary}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
