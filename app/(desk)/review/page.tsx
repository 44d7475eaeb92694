import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { LapsedTable } from "@/components/review/lapsed-table";
import { QueueTable } from "@/components/review/queue-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { lapseOverdueQuietly } from "@/lib/requests/lapse";
import { listRecentlyLapsed, listReviewQueue } from "@/lib/review/queue";

export const metadata: Metadata = { title: "Review queue" };

const LAPSED_DAYS = 7;

export default async function ReviewQueuePage() {
  await requirePageRole("director");
  const db = getDb();
  const now = new Date();
  // Whatever passed its deadline since the last minute's run lapses before the queue is read.
  await lapseOverdueQuietly(db, now);
  const [items, lapsed] = await Promise.all([listReviewQueue(db, now), listRecentlyLapsed(db, now, LAPSED_DAYS)]);
  return (
    <>
      <PageHeader title="Review queue">
        <p className="text-xs text-muted">Most urgent first: urgency, then deadline, then the next observable window.</p>
      </PageHeader>
      <QueueTable items={items} />
      {lapsed.length > 0 && <LapsedTable items={lapsed} days={LAPSED_DAYS} />}
    </>
  );
}
