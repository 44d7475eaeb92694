import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/index";
import { StateBadge } from "@/components/requests/state-badge";
import { buttonClass } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { URGENCY_SHORT } from "@/lib/requests/labels";
import { lapseOverdueQuietly } from "@/lib/requests/lapse";
import { listRequestsForPi } from "@/lib/requests/queries";
import { formatUt } from "@/lib/time/format";

export const metadata: Metadata = { title: "ToO requests" };

export default async function RequestsPage() {
  const user = await requirePageRole("pi");
  const db = getDb();
  // A request past its deadline shows as lapsed at once, not only after the minute job's next run.
  await lapseOverdueQuietly(db);
  const requests = await listRequestsForPi(db, user.id);
  return (
    <>
      <PageHeader title="ToO requests">
        <Link href="/requests/new" className={buttonClass("flare")}>
          New request
        </Link>
      </PageHeader>
      {requests.length === 0 ? (
        <EmptyState>You have not filed any override requests yet.</EmptyState>
      ) : (
        <div className="scroll-cue overflow-x-auto rounded-lg border border-line bg-raised">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Your requests</caption>
            <thead className="bg-sunken text-2xs uppercase tracking-wide text-muted">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">Target</th>
                <th scope="col" className="px-3 py-2 font-medium">State</th>
                <th scope="col" className="px-3 py-2 font-medium">Program</th>
                <th scope="col" className="px-3 py-2 font-medium">Urgency</th>
                <th scope="col" className="px-3 py-2 font-medium">Telescopes</th>
                <th scope="col" className="px-3 py-2 font-medium">Deadline (UT)</th>
                <th scope="col" className="px-3 py-2 font-medium">Last change (UT)</th>
              </tr>
            </thead>
            <tbody>
              {requests.map((r) => (
                <tr key={r.id} className="border-t border-line align-top">
                  <td className="px-3 py-2">
                    <Link href={`/requests/${r.id}`} className="font-medium underline">
                      {r.targetName || "Untitled draft"}
                    </Link>
                  </td>
                  <td className="px-3 py-2">
                    <StateBadge state={r.state} />
                  </td>
                  <td className="num px-3 py-2">{r.programCode ?? "—"}</td>
                  <td className="px-3 py-2">{r.urgency ? URGENCY_SHORT[r.urgency] : "—"}</td>
                  <td className="num px-3 py-2">{r.telescopeCodes.join(", ") || "—"}</td>
                  <td className="num px-3 py-2">{r.deadline ? formatUt(r.deadline) : "—"}</td>
                  <td className="num px-3 py-2">{formatUt(r.updatedAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
