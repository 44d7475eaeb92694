import Link from "next/link";
import { getDb } from "@/db/index";
import { UrgencyBadge } from "@/components/review/urgency-badge";
import { EmptyState } from "@/components/ui/empty-state";
import { listOwedToObserver, type ObserverOwed } from "@/lib/ledger/owed";
import { countConsortium, listProgramsForPi } from "@/lib/programs/queries";
import { listPiAttention } from "@/lib/requests/attention";
import { listBlocksForObserver, listBlocksOnTelescopes } from "@/lib/schedule/queries";
import { listReviewQueue } from "@/lib/review/queue";
import { listTelescopesForAssistant } from "@/lib/telescopes/queries";
import { formatDuration, formatUt } from "@/lib/time/format";
import { BlockList } from "./block-list";
import { PiAttentionList } from "./pi-attention";
import { HomeSection } from "./section";

const HOUR = 3_600_000;

export async function PiSection({ userId }: { userId: string }) {
  const now = new Date();
  const [programs, attention] = await Promise.all([listProgramsForPi(getDb(), userId), listPiAttention(getDb(), userId, now)]);
  return (
    <HomeSection id="home-pi" title="Your programs and override requests">
      {programs.length ? (
        <ul className="divide-y divide-line">
          {programs.map((p) => (
            <li key={p.id} className="flex items-baseline gap-3 py-1.5">
              <span className="num w-28 shrink-0">{p.code}</span>
              <span className="flex-1">{p.title}</span>
              <span className="num text-muted">{p.allocatedHours} h</span>
              {p.tooAllowed && <span className="text-2xs font-semibold uppercase text-flare-ink">ToO time</span>}
            </li>
          ))}
        </ul>
      ) : (
        <EmptyState>You lead no programs this semester.</EmptyState>
      )}
      <PiAttentionList attention={attention} now={now} />
    </HomeSection>
  );
}

export async function DirectorSection() {
  const queue = await listReviewQueue(getDb(), new Date());
  return (
    <HomeSection id="home-director" title="Requests waiting for a decision">
      {queue.length ? (
        <>
          <p className="mb-2">
            <span className="num font-semibold">{queue.length}</span> override request{queue.length === 1 ? "" : "s"} waiting, most urgent first.
          </p>
          <ul className="divide-y divide-line">
            {queue.slice(0, 3).map((r) => (
              <li key={r.id} className="flex flex-wrap items-baseline gap-3 py-1.5">
                <UrgencyBadge urgency={r.urgency} />
                <Link href={`/review/${r.id}`} className="font-medium underline">{r.targetName}</Link>
                <span className="num text-muted">{r.programCode ?? "—"}</span>
                <span className="text-xs text-muted">{r.summary}</span>
              </li>
            ))}
          </ul>
          <p className="mt-3"><Link href="/review" className="underline">Open the review queue</Link></p>
        </>
      ) : (
        <EmptyState>No override requests are waiting for review.</EmptyState>
      )}
    </HomeSection>
  );
}

export async function ObserverSection({ userId }: { userId: string }) {
  const now = new Date();
  const blocks = await listBlocksForObserver(getDb(), userId, now, new Date(now.getTime() + 14 * 24 * HOUR), 10);
  return (
    <HomeSection id="home-observer" title="Your blocks in the next two weeks">
      <BlockList blocks={blocks} empty="You are not scheduled on any telescope in the next two weeks." />
      <OwedLines owed={await listOwedToObserver(getDb(), userId, now)} />
    </HomeSection>
  );
}

function OwedLines({ owed }: { owed: ObserverOwed[] }) {
  if (!owed.length) return null;
  return (
    <div className="mt-3 border-t border-line pt-3">
      <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-muted">Time owed to your programs</h3>
      <ul className="divide-y divide-line">
        {owed.map((o) => (
          <li key={o.programId} className="flex flex-wrap items-baseline gap-3 py-1.5">
            <span className="num w-28 shrink-0">{o.programCode}</span>
            <span className="flex-1">
              {o.owedMinutes > 0 ? <>owed <strong className="num">{formatDuration(o.owedMinutes)}</strong></> : "repaid in full"}
              {o.yourDisplacedMinutes > 0 && <span className="text-muted"> · {formatDuration(o.yourDisplacedMinutes)} taken from your blocks</span>}
            </span>
            {o.nextPayback && <span className="num text-xs text-muted">payback on {o.nextPayback.telescopeCode} from {formatUt(o.nextPayback.startsAt)} UT</span>}
          </li>
        ))}
      </ul>
      <p className="mt-2"><Link href="/ledger" className="underline">See the ledger</Link></p>
    </div>
  );
}

export async function NightAssistantSection({ userId }: { userId: string }) {
  const db = getDb();
  const telescopes = await listTelescopesForAssistant(db, userId);
  const now = new Date();
  const blocks = await listBlocksOnTelescopes(db, telescopes.map((t) => t.id), now, new Date(now.getTime() + 18 * HOUR));
  return (
    <HomeSection id="home-night" title="Coming up on your telescopes">
      {telescopes.length ? (
        <p className="mb-2 text-muted">{telescopes.map((t) => `${t.name} (${t.siteName})`).join(" · ")}</p>
      ) : null}
      <BlockList blocks={blocks} empty="Nothing is scheduled on your telescopes in the next 18 hours." />
    </HomeSection>
  );
}

export async function AdminSection() {
  const counts = await countConsortium(getDb());
  return (
    <HomeSection id="home-admin" title="Consortium at a glance">
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        {Object.entries(counts).map(([label, n]) => (
          <div key={label} className="rounded-md bg-sunken px-3 py-2">
            <dt className="text-2xs uppercase tracking-wide text-muted">{label}</dt>
            <dd className="num text-lg">{n}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-3">
        <Link href="/admin/users" className="underline">Manage users and roles</Link>
      </p>
    </HomeSection>
  );
}
