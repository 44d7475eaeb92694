import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/index";
import { DeliveryLog } from "@/components/notices/delivery-log";
import { FaultForm } from "@/components/notices/fault-form";
import { Alert } from "@/components/ui/alert";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { cn } from "@/lib/cn";
import { countDeliveriesByStatus, listRecentDeliveries } from "@/lib/notices/deliveries";
import { getCapturedEmail, getFakeControl, listCapturedEmails, localFakeUrl, type CapturedEmail, type FakeControl } from "@/lib/notices/outbox";
import { formatUt } from "@/lib/time/format";
import { setFakeFaultsAction } from "./actions";

export const metadata: Metadata = { title: "Development outbox" };

type Captured = { control: FakeControl; total: number; emails: CapturedEmail[]; selected: CapturedEmail | null };

async function readFake(base: string, selectedId: string | undefined): Promise<Captured | string> {
  try {
    const [control, list] = await Promise.all([getFakeControl(base), listCapturedEmails(base, 200)]);
    const selected = selectedId ? await getCapturedEmail(base, selectedId) : (list.emails[0] ?? null);
    return { control, total: list.total, emails: list.emails, selected };
  } catch (error) {
    return `The local e-mail fake at ${base} does not answer (${error instanceof Error ? error.message : String(error)}).`;
  }
}

export default async function OutboxPage({ searchParams }: { searchParams: Promise<{ message?: string | string[] }> }) {
  await requirePageRole("admin");
  const { message } = await searchParams;
  const base = localFakeUrl();
  const [fake, deliveries, counts] = await Promise.all([
    base ? readFake(base, typeof message === "string" ? message : undefined) : Promise.resolve(null),
    listRecentDeliveries(getDb(), 50),
    countDeliveriesByStatus(getDb()),
  ]);

  return (
    <>
      <PageHeader title="Development outbox" />
      {!base && (
        <Alert tone="info">
          RESEND_BASE_URL does not point at a local fake on this machine, so e-mail goes to the real mail service and there is no outbox
          to show. The delivery log below still lists every e-mail the desk queued.
        </Alert>
      )}
      {typeof fake === "string" && <Alert tone="error">{fake}</Alert>}
      {fake && typeof fake !== "string" && (
        <>
          <section aria-labelledby="faults-heading" className="mb-6 rounded-lg border border-line bg-raised p-4">
            <h2 id="faults-heading" className="mb-1 font-semibold">
              Mail service faults
            </h2>
            <p className="num mb-3 text-xs text-muted">
              requests {fake.control.stats.requests} · injected failures {fake.control.stats.injectedFailures} · stored {fake.control.stats.stored} ·
              idempotent replays {fake.control.stats.idempotentReplays}
            </p>
            <FaultForm initial={fake.control.faults} save={setFakeFaultsAction} />
          </section>
          <section aria-labelledby="captured-heading" className="mb-8 grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
            <div>
              <h2 id="captured-heading" className="mb-2 font-semibold">
                Captured e-mails <span className="num text-sm font-normal text-muted">({fake.total})</span>
              </h2>
              {fake.emails.length === 0 ? (
                <EmptyState>Nothing sent yet.</EmptyState>
              ) : (
                <ul className="max-h-[640px] divide-y divide-line overflow-y-auto rounded-lg border border-line bg-raised">
                  {fake.emails.map((e) => (
                    <li key={e.id}>
                      <Link
                        href={`/admin/outbox?message=${e.id}`}
                        aria-current={fake.selected?.id === e.id ? "true" : undefined}
                        className={cn("block px-3 py-2 hover:bg-sunken", fake.selected?.id === e.id && "bg-sunken")}
                      >
                        <span className="block truncate text-sm">{e.subject}</span>
                        <span className="num block truncate text-2xs text-muted">
                          {formatUt(e.createdAt)} UT · {e.to.join(", ")}
                        </span>
                      </Link>
                    </li>
                  ))}
                </ul>
              )}
            </div>
            <div>{fake.selected ? <MessageView email={fake.selected} /> : <EmptyState>Pick an e-mail to see it.</EmptyState>}</div>
          </section>
        </>
      )}
      <section aria-labelledby="log-heading">
        <h2 id="log-heading" className="mb-2 font-semibold">
          Delivery log
        </h2>
        {deliveries.length === 0 ? <EmptyState>No e-mail has been queued yet.</EmptyState> : <DeliveryLog entries={deliveries} counts={counts} />}
      </section>
    </>
  );
}

function MessageView({ email }: { email: CapturedEmail }) {
  const rows: Array<[string, string, boolean]> = [
    ["From", email.from, false],
    ["To", email.to.join(", "), false],
    ["Reply to", email.replyTo.join(", ") || "—", false],
    ["Subject", email.subject, false],
    ["Received", `${formatUt(email.createdAt)} UT`, true],
    ["Idempotency key", email.idempotencyKey ?? "—", true],
  ];
  return (
    <article aria-label={`E-mail: ${email.subject}`} className="rounded-lg border border-line bg-raised p-3">
      <dl className="mb-3 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
        {rows.map(([k, v, mono]) => (
          <div key={k} className="contents">
            <dt className="text-muted">{k}</dt>
            <dd className={cn("break-all", mono && "num")}>{v}</dd>
          </div>
        ))}
      </dl>
      {email.html !== null && (
        // An empty sandbox: the captured HTML can neither run scripts nor reach this page.
        <iframe title={`HTML of ${email.subject}`} sandbox="" srcDoc={email.html} className="h-[560px] w-full rounded border border-line bg-white" />
      )}
      {email.text !== null && (
        <details className="mt-3">
          <summary className="cursor-pointer text-sm text-muted">Plain text</summary>
          <pre className="num mt-2 max-h-96 overflow-auto whitespace-pre-wrap rounded bg-sunken p-3 text-xs">{email.text}</pre>
        </details>
      )}
    </article>
  );
}
