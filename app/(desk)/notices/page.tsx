import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/index";
import { NOTICE_EVENTS } from "@/db/types";
import { NoticeList } from "@/components/notices/notice-list";
import { PreferencesForm } from "@/components/notices/preferences-form";
import { PageHeader } from "@/components/ui/page-header";
import { hasAnyRole } from "@/lib/auth/roles";
import { requirePageRole } from "@/lib/auth/session";
import { NOTICE_EVENT_LABELS } from "@/lib/notices/events";
import { localFakeUrl } from "@/lib/notices/outbox";
import { getEmailPreferences, listNoticesForUser } from "@/lib/notices/queries";
import { markAllNoticesReadAction, markNoticeReadAction, saveEmailPreferencesAction } from "./actions";

export const metadata: Metadata = { title: "Notices" };

export default async function NoticesPage() {
  const user = await requirePageRole();
  const [notices, prefs] = await Promise.all([listNoticesForUser(getDb(), user.id, { limit: 100 }), getEmailPreferences(getDb(), user.id)]);
  const showOutbox = user.roles.includes("admin") && localFakeUrl() !== null;
  // Only the events the person's roles receive; the others keep whatever was stored.
  const options = NOTICE_EVENTS.filter((event) => hasAnyRole(user.roles, NOTICE_EVENT_LABELS[event].roles)).map((event) => ({
    event,
    label: NOTICE_EVENT_LABELS[event].label,
    email: prefs[event],
  }));
  return (
    <>
      <PageHeader title="Notices">
        {showOutbox && (
          <Link href="/admin/outbox" className="text-sm text-muted underline-offset-2 hover:text-text hover:underline">
            Development outbox
          </Link>
        )}
      </PageHeader>
      <NoticeList
        notices={notices.map((n) => ({ id: n.id, title: n.title, body: n.body, link: n.link, createdAt: n.createdAt.toISOString(), read: n.readAt !== null }))}
        markRead={markNoticeReadAction}
        markAllRead={markAllNoticesReadAction}
      />
      <section id="preferences" aria-labelledby="preferences-heading" className="mt-8 rounded-lg border border-line bg-raised p-4">
        <h2 id="preferences-heading" className="mb-1 font-semibold">
          E-mail preferences
        </h2>
        <p className="mb-3 text-sm text-muted">Every notice appears here. Choose which ones also reach you by e-mail.</p>
        {options.length === 0 ? (
          <p className="text-sm text-muted">None of your roles receives notices.</p>
        ) : (
          <PreferencesForm options={options} save={saveEmailPreferencesAction} />
        )}
      </section>
    </>
  );
}
