import type { Metadata } from "next";
import { CreateFeedForm } from "@/components/feeds/create-feed-form";
import { ExportLinks } from "@/components/feeds/export-links";
import { FeedList } from "@/components/feeds/feed-list";
import { PageHeader } from "@/components/ui/page-header";
import { getDb } from "@/db/index";
import { requirePageRole } from "@/lib/auth/session";
import { listFeedsForOwner, listFeedTargets } from "@/lib/calendar-feeds/queries";
import { createFeedAction, revokeFeedAction } from "./actions";

export const metadata: Metadata = { title: "Calendar feeds" };

export default async function FeedsPage() {
  const user = await requirePageRole();
  const db = getDb();
  const [feeds, targets] = await Promise.all([listFeedsForOwner(db, user.id), listFeedTargets(db)]);
  return (
    <>
      <PageHeader title="Calendar feeds" />
      <p className="mb-4 max-w-3xl text-muted">
        Follow the schedule in your own calendar app. A feed has a secret address: anyone who has it can read the blocks it
        shows, so keep it to yourself and revoke it if it leaks. Calendar apps refresh feeds on their own schedule, often only a
        few times a day.
      </p>
      <section className="mb-8 rounded-lg border border-line bg-raised p-4">
        <h2 className="mb-3 font-semibold">New feed</h2>
        <CreateFeedForm userId={user.id} targets={targets} action={createFeedAction} />
      </section>
      <section className="mb-8">
        <h2 className="mb-2 font-semibold">My feeds</h2>
        <FeedList feeds={feeds.map((f) => ({ id: f.id, label: f.label, createdAt: f.createdAt.toISOString(), revokedAt: f.revokedAt?.toISOString() ?? null }))} revoke={revokeFeedAction} />
      </section>
      <section>
        <h2 className="mb-2 font-semibold">Download once</h2>
        <ExportLinks userId={user.id} targets={targets} />
      </section>
    </>
  );
}
