import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { z } from "zod";
import { getDb } from "@/db/index";
import { AttachmentList } from "@/components/requests/attachment-list";
import { FeasibilityView } from "@/components/requests/feasibility-view";
import { PlanningCaution } from "@/components/requests/planning-caution";
import { RequestForm } from "@/components/requests/request-form";
import { RequestHistory } from "@/components/requests/request-history";
import { RequestSummary } from "@/components/requests/request-summary";
import { StateBadge } from "@/components/requests/state-badge";
import { WithdrawForm } from "@/components/requests/withdraw-form";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { listAttachments } from "@/lib/attachments/queries";
import { requirePageRole } from "@/lib/auth/session";
import { cachedVisibility } from "@/lib/requests/feasibility/cache";
import { computeFeasibility } from "@/lib/requests/feasibility/compute";
import { feasibilityInputOf } from "@/lib/requests/feasibility/from-request";
import { loadFormOptions } from "@/lib/requests/form-options";
import { requestFormValues } from "@/lib/requests/form-values";
import { lapseOverdueQuietly } from "@/lib/requests/lapse";
import { listRequestEvents } from "@/lib/requests/queries";
import { findInstrumentOption, listTelescopesForSky } from "@/lib/requests/reference-queries";
import { findRequestForViewer } from "@/lib/requests/service";
import { formatUt } from "@/lib/time/format";
import { saveDraftAction, submitRequestAction, withdrawRequestAction } from "../actions";

export const metadata: Metadata = { title: "ToO request" };

// While a request is still open its feasibility is recomputed from now; afterwards the
// check made at filing is what counts.
const OPEN = ["submitted", "in_review", "approved"];
const WITHDRAWABLE = ["submitted", "in_review"];

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-3 rounded-lg border border-line bg-raised p-4">
      <h2 className="font-semibold">{title}</h2>
      {children}
    </section>
  );
}

export default async function RequestPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole("pi", "director");
  const { id } = await params;
  if (!z.uuid().safeParse(id).success) notFound();
  const db = getDb();
  // Past its deadline an undecided request lapses before it is shown (the minute job may not have run yet).
  await lapseOverdueQuietly(db);
  const request = await findRequestForViewer(db, user, id);
  if (!request) notFound();
  const [events, attachments] = await Promise.all([listRequestEvents(db, id), listAttachments(db, id)]);
  const title = request.targetName || "Untitled draft";

  if (request.state === "draft") {
    const options = await loadFormOptions(db, user.id);
    return (
      <>
        <PageHeader title={title}>
          <StateBadge state="draft" />
        </PageHeader>
        {request.directorNote && events.length > 1 && (
          <div className="mb-4">
            <Alert tone="caution">Returned by the director: {request.directorNote}</Alert>
          </div>
        )}
        <RequestForm
          draftId={id}
          initial={requestFormValues(request)}
          attachments={attachments.map((a) => ({ id: a.id, kind: a.kind, fileName: a.fileName, contentType: a.contentType, sizeBytes: a.sizeBytes, url: a.url }))}
          saveDraft={saveDraftAction}
          submit={submitRequestAction}
          {...options}
        />
      </>
    );
  }

  const telescopes = await listTelescopesForSky(db, request.telescopes.map((t) => t.id));
  const timeZone = telescopes[0]?.site.timeZone ?? "UTC";
  const input = OPEN.includes(request.state) ? feasibilityInputOf(request) : null;
  const instrument = input?.instrumentId ? await findInstrumentOption(db, input.instrumentId) : undefined;
  const live = input ? computeFeasibility(input, telescopes, instrument ?? null, new Date(), { visibility: cachedVisibility }) : null;
  const filedCheck = request.feasibility;
  const mayWithdraw = request.piUserId === user.id && WITHDRAWABLE.includes(request.state);

  return (
    <>
      <PageHeader title={title}>
        <div className="flex items-center gap-3">
          <StateBadge state={request.state} />
          {mayWithdraw && <WithdrawForm requestId={id} action={withdrawRequestAction} />}
        </div>
      </PageHeader>
      {request.state === "lapsed" && (
        <div className="mb-4">
          <Alert tone="caution">
            The deadline{request.deadline && <> ({formatUt(request.deadline)} UT)</>} passed before a director decided: this request lapsed and will
            not be scheduled. If the target is still worth observing, file a new request with a later deadline.
          </Alert>
        </div>
      )}
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <div className="flex flex-col gap-6">
          <Section title="Request">
            <RequestSummary request={request} timeZone={timeZone} />
          </Section>
          <Section title="Attachments">
            <AttachmentList items={attachments} />
          </Section>
          <Section title="History">
            <RequestHistory events={events} timeZone={timeZone} />
          </Section>
        </div>
        <Section title="Feasibility">
          {filedCheck && (
            <Alert tone={filedCheck.verdict === "feasible" ? "ok" : "error"}>
              At filing ({formatUt(new Date(filedCheck.computedAt))} UT): {filedCheck.verdict === "feasible" ? "feasible" : "refused"}.{" "}
              {filedCheck.telescopes.map((t) => t.reason).join(" ")}
            </Alert>
          )}
          {live ? <FeasibilityView report={live} targetName={request.targetName} /> : <PlanningCaution />}
        </Section>
      </div>
    </>
  );
}
