import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/index";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { listCalendarTelescopes, type CalendarTelescope } from "@/lib/schedule/calendar-queries";
import { listTelescopesForAssistant } from "@/lib/telescopes/queries";
import { QUEUE_VIEW_ROLES } from "@/lib/tonight/access";
import { tonightOf } from "@/lib/tonight/night";

export const metadata: Metadata = { title: "Tonight" };

function TelescopeLinks({ telescopes, now }: { telescopes: CalendarTelescope[]; now: Date }) {
  return (
    <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
      {telescopes.map((t) => (
        <li key={t.id}>
          <Link href={`/tonight/${encodeURIComponent(t.code)}`} className="block rounded-lg border border-line bg-raised p-4 hover:bg-sunken">
            <span className="block text-xl font-semibold">
              {t.code} <span className="font-normal text-muted">· {t.name}</span>
            </span>
            <span className="block text-base">{t.siteName}</span>
            <span className="num block text-sm text-muted">
              Night of {tonightOf({ latitudeDeg: t.latitudeDeg, longitudeDeg: t.longitudeDeg, heightM: t.heightM, timeZone: t.timeZone }, now)} · {t.timeZone}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

export default async function TonightPage() {
  const user = await requirePageRole(...QUEUE_VIEW_ROLES);
  const db = getDb();
  const [all, mine] = await Promise.all([listCalendarTelescopes(db), user.roles.includes("night_assistant") ? listTelescopesForAssistant(db, user.id) : []]);
  const mineIds = new Set(mine.map((t) => t.id));
  const yours = all.filter((t) => mineIds.has(t.id));
  const others = all.filter((t) => !mineIds.has(t.id));
  const now = new Date();
  return (
    <div className="grid gap-6 text-base">
      <PageHeader title="Tonight's queue" />
      <p>Choose a telescope to see its queue for the night: the blocks in order, what changed, and the night log.</p>
      {yours.length > 0 && (
        <section aria-labelledby="tonight-yours" className="grid gap-3">
          <h2 id="tonight-yours" className="text-lg font-semibold">
            Your telescopes
          </h2>
          <TelescopeLinks telescopes={yours} now={now} />
        </section>
      )}
      {others.length > 0 && (
        <section aria-labelledby="tonight-others" className="grid gap-3">
          <h2 id="tonight-others" className="text-lg font-semibold">
            {yours.length > 0 ? "Other telescopes" : "Telescopes"}
          </h2>
          <TelescopeLinks telescopes={others} now={now} />
        </section>
      )}
      {all.length === 0 && <p className="text-muted">No telescopes are set up yet.</p>}
    </div>
  );
}
