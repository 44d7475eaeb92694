import Link from "next/link";
import { getDb } from "@/db/index";
import { EmptyState } from "@/components/ui/empty-state";
import { countConsortium, listProgramsForPi } from "@/lib/programs/queries";
import { listBlocksForObserver, listBlocksOnTelescopes } from "@/lib/schedule/queries";
import { listTelescopesForAssistant } from "@/lib/telescopes/queries";
import { BlockList } from "./block-list";
import { HomeSection } from "./section";

const HOUR = 3_600_000;

export async function PiSection({ userId }: { userId: string }) {
  const programs = await listProgramsForPi(getDb(), userId);
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
      <p className="mt-3 text-muted">No override requests need your attention.</p>
    </HomeSection>
  );
}

export function DirectorSection() {
  return (
    <HomeSection id="home-director" title="Requests waiting for a decision">
      <EmptyState>No override requests are waiting for review.</EmptyState>
    </HomeSection>
  );
}

export async function ObserverSection({ userId }: { userId: string }) {
  const now = new Date();
  const blocks = await listBlocksForObserver(getDb(), userId, now, new Date(now.getTime() + 14 * 24 * HOUR), 10);
  return (
    <HomeSection id="home-observer" title="Your blocks in the next two weeks">
      <BlockList blocks={blocks} empty="You are not scheduled on any telescope in the next two weeks." />
    </HomeSection>
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
