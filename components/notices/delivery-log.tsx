import type { DeliveryStatus } from "@/db/types";
import { cn } from "@/lib/cn";
import type { DeliveryLogEntry } from "@/lib/notices/deliveries";
import { formatUt } from "@/lib/time/format";

const STATUS_CLASS: Record<DeliveryStatus, string> = {
  queued: "text-muted",
  sending: "text-text",
  retrying: "text-flare-ink",
  sent: "text-ok",
  failed: "text-danger",
};

/** The outbound e-mail log as the worker left it. */
export function DeliveryLog({ entries, counts }: { entries: DeliveryLogEntry[]; counts: Record<DeliveryStatus, number> }) {
  return (
    <>
      <p className="num mb-2 text-xs text-muted">
        {(Object.keys(counts) as DeliveryStatus[]).map((s) => `${s} ${counts[s]}`).join(" · ")}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm">
          <thead className="text-2xs uppercase tracking-wide text-muted">
            <tr>
              <th className="py-1 pr-3 font-medium">Queued (UT)</th>
              <th className="py-1 pr-3 font-medium">Recipient</th>
              <th className="py-1 pr-3 font-medium">Event</th>
              <th className="py-1 pr-3 font-medium">Status</th>
              <th className="py-1 pr-3 font-medium">Attempts</th>
              <th className="py-1 font-medium">Last error</th>
            </tr>
          </thead>
          <tbody>
            {entries.map((e) => (
              <tr key={e.key} className="border-t border-line align-top">
                <td className="num py-1.5 pr-3 whitespace-nowrap">{formatUt(e.createdAt)}</td>
                <td className="num py-1.5 pr-3">{e.recipient}</td>
                <td className="py-1.5 pr-3">{e.template}</td>
                <td className={cn("py-1.5 pr-3 font-medium", STATUS_CLASS[e.status])}>{e.status}</td>
                <td className="num py-1.5 pr-3">{e.attempts}</td>
                <td className="py-1.5 text-xs text-muted">{e.lastError}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
