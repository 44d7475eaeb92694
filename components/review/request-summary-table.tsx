import Link from "next/link";
import { StateBadge } from "@/components/requests/state-badge";
import type { RequestState, RequestUrgency } from "@/db/types";
import { formatUt } from "@/lib/time/format";
import { UrgencyBadge } from "./urgency-badge";

export interface RequestSummaryRow {
  id: string;
  urgency: RequestUrgency | null;
  targetName: string;
  durationMinutes: number | null;
  telescopeCodes: string[];
  state: RequestState;
  piName: string;
  programCode: string | null;
  deadline: Date | null;
  /** The feasibility column, shown when the table has one. */
  summary?: string;
}

/** One line per request for the director: urgency, target, state, PI, program, deadline (and feasibility). */
export function RequestSummaryTable({ rows, caption, feasibility = false }: { rows: RequestSummaryRow[]; caption: string; feasibility?: boolean }) {
  return (
    <div className="scroll-cue overflow-x-auto rounded-lg border border-line bg-raised">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-sunken text-2xs uppercase tracking-wide text-muted">
          <tr>
            {["Urgency", "Target", "State", "PI", "Program", "Deadline (UT)", ...(feasibility ? ["Feasibility"] : [])].map((label) => (
              <th key={label} scope="col" className="px-3 py-2 font-medium">
                {label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
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
              {feasibility && <td className="px-3 py-2 text-xs">{r.summary}</td>}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
