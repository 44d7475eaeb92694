import Link from "next/link";
import { Instant } from "@/components/time/instant";
import { TimeRange } from "@/components/time/time-range";
import type { DraftRequest, PiAttention, ReturnedRequest, UpcomingOverride } from "@/lib/requests/attention";
import { formatUt } from "@/lib/time/format";

const DRAFTS_SHOWN = 5;

/** The PI's to-do list on the home page: returned requests first, then drafts, then their overrides to come. */
export function PiAttentionList({ attention, now }: { attention: PiAttention; now: Date }) {
  const { returned, drafts, overrides } = attention;
  if (!returned.length && !drafts.length && !overrides.length) {
    return <p className="mt-3 text-muted">No override requests need your attention.</p>;
  }
  return (
    <div className="mt-3 grid gap-3 border-t border-line pt-3">
      {returned.length > 0 && (
        <Group title="Returned to you for changes">
          {returned.map((r) => <ReturnedItem key={r.id} request={r} />)}
        </Group>
      )}
      {drafts.length > 0 && (
        <Group title="Drafts not yet filed">
          {drafts.slice(0, DRAFTS_SHOWN).map((d) => <DraftItem key={d.id} draft={d} />)}
          {drafts.length > DRAFTS_SHOWN && (
            <li className="py-1.5 text-muted">
              and {drafts.length - DRAFTS_SHOWN} more: <Link href="/requests" className="underline">see all your requests</Link>
            </li>
          )}
        </Group>
      )}
      {overrides.length > 0 && (
        <Group title="Your approved overrides">
          {overrides.map((o) => <OverrideItem key={o.requestId} override={o} now={now} />)}
        </Group>
      )}
    </div>
  );
}

function Group({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div>
      <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-muted">{title}</h3>
      <ul className="divide-y divide-line">{children}</ul>
    </div>
  );
}

function ReturnedItem({ request: r }: { request: ReturnedRequest }) {
  return (
    <li className="py-1.5">
      <div className="flex flex-wrap items-baseline gap-3">
        <Link href={`/requests/${r.id}`} className="font-medium underline">{r.targetName || "Untitled request"}</Link>
        <span className="num text-muted">{r.programCode ?? "—"}</span>
        <span className="text-xs text-muted">
          returned by {r.returnedBy} <Instant at={r.returnedAt} timeZone={r.timeZone} />
        </span>
      </div>
      <blockquote className="mt-1 whitespace-pre-wrap border-l-2 border-flare pl-3">{r.note}</blockquote>
      <p className="mt-1 text-xs">
        <Link href={`/requests/${r.id}`} className="underline">Edit and file it again</Link>
      </p>
    </li>
  );
}

function DraftItem({ draft: d }: { draft: DraftRequest }) {
  return (
    <li className="flex flex-wrap items-baseline gap-3 py-1.5">
      <Link href={`/requests/${d.id}`} className="font-medium underline">{d.targetName || "Untitled draft"}</Link>
      <span className="num text-muted">{d.programCode ?? "—"}</span>
      <span className="num text-xs text-muted">last edited {formatUt(d.updatedAt)} UT</span>
    </li>
  );
}

function OverrideItem({ override: o, now }: { override: UpcomingOverride; now: Date }) {
  return (
    <li className="flex flex-wrap items-baseline gap-3 py-1.5">
      <span className="w-56 shrink-0"><TimeRange start={o.startsAt} end={o.endsAt} timeZone={o.site.timeZone} /></span>
      <span className="whitespace-nowrap">{o.telescope.name} <span className="num text-muted">{o.telescope.code}</span></span>
      <Link href={`/requests/${o.requestId}`} className="font-medium underline">{o.targetName}</Link>
      <span className="num text-muted">{o.programCode}</span>
      {o.startsAt <= now && <span className="text-2xs font-semibold uppercase text-flare-ink">under way</span>}
    </li>
  );
}
