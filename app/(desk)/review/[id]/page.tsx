import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { z } from "zod";
import { getDb } from "@/db/index";
import { FeasibilityView } from "@/components/requests/feasibility-view";
import { PlanningCaution } from "@/components/requests/planning-caution";
import { RequestSummary } from "@/components/requests/request-summary";
import { StateBadge } from "@/components/requests/state-badge";
import { DecisionSummary } from "@/components/review/decision-summary";
import { ReviewDesk } from "@/components/review/review-desk";
import { UrgencyBadge } from "@/components/review/urgency-badge";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { computeFeasibility } from "@/lib/requests/feasibility/compute";
import { feasibilityInputOf } from "@/lib/requests/feasibility/from-request";
import { findRequestById } from "@/lib/requests/queries";
import { lapseOverdueQuietly } from "@/lib/requests/lapse";
import { findInstrumentOption, listTelescopesForSky } from "@/lib/requests/reference-queries";
import { findLatestDecision } from "@/lib/review/decision-record";
import { markInReview } from "@/lib/review/service";
import { listCalendarTelescopes } from "@/lib/schedule/calendar-queries";
import { findSlotsForRequest } from "@/lib/slot-finder/service";
import { decideAction } from "./actions";

export const metadata: Metadata = { title: "Review a ToO request" };

const OPEN = ["submitted", "in_review"];
const MINUTE = 60_000;

export default async function ReviewPage({ params }: { params: Promise<{ id: string }> }) {
  const director = await requirePageRole("director");
  const { id } = await params;
  if (!z.uuid().safeParse(id).success) notFound();
  const db = getDb();
  const now = new Date();
  // A request past its deadline lapses first: it is not opened for review, nor offered a decision.
  await lapseOverdueQuietly(db, now);
  // Opening a submitted request puts it in review: the PI sees that a director is on it.
  await markInReview(db, director, id);
  // A request returned to the PI is a draft again: the director still sees what was decided.
  // A lapsed one was never decided (an earlier return to the PI is not the answer to show).
  const request = await findRequestById(db, id);
  const record = request && !OPEN.includes(request.state) && request.state !== "lapsed" ? await findLatestDecision(db, id) : undefined;
  if (!request || (request.state === "draft" && record?.decision !== "return")) notFound();
  const open = OPEN.includes(request.state);

  const ids = request.telescopes.map((t) => t.id);
  const [skyTelescopes, calendarTelescopes] = await Promise.all([listTelescopesForSky(db, ids), listCalendarTelescopes(db)]);
  const timeZone = skyTelescopes[0]?.site.timeZone ?? "UTC";
  const input = open ? feasibilityInputOf(request) : null;
  const instrument = input?.instrumentId ? await findInstrumentOption(db, input.instrumentId) : undefined;
  const feasibility = input ? computeFeasibility(input, skyTelescopes, instrument ?? null, now) : null;
  const slots = open ? await findSlotsForRequest(db, request, now) : null;

  const acceptable = calendarTelescopes.filter((t) => ids.includes(t.id));
  const first = slots?.suggestions[0];
  const start = Math.ceil((slots?.usable.start ?? now.getTime()) / MINUTE) * MINUTE;
  const initialSlot = first
    ? { telescopeId: first.telescopeId, start: first.start, end: first.end }
    : { telescopeId: acceptable[0]?.id ?? "", start, end: start + (request.durationMinutes ?? 60) * MINUTE };

  return (
    <>
      <PageHeader title={request.targetName}>
        <div className="flex items-center gap-2">
          <UrgencyBadge urgency={request.urgency} />
          <StateBadge state={request.state} />
        </div>
      </PageHeader>
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <div className="flex flex-col gap-6">
          <section aria-label="Request" className="flex flex-col gap-3 rounded-lg border border-line bg-raised p-4">
            <h2 className="font-semibold">Request</h2>
            <RequestSummary request={request} timeZone={timeZone} />
          </section>
          <section aria-label="Feasibility" className="flex flex-col gap-3 rounded-lg border border-line bg-raised p-4">
            <h2 className="font-semibold">Feasibility per telescope</h2>
            {feasibility ? <FeasibilityView report={feasibility} targetName={request.targetName} /> : <PlanningCaution />}
          </section>
        </div>
        {open && slots ? (
          <ReviewDesk requestId={id} telescopes={acceptable} suggestions={slots.suggestions} reason={slots.reason} note={slots.note} initialSlot={initialSlot} action={decideAction} />
        ) : (
          <DecisionSummary state={request.state} record={record} deadline={request.deadline} />
        )}
      </div>
    </>
  );
}
