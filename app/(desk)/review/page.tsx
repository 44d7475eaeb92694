import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { QueueTable } from "@/components/review/queue-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { listReviewQueue } from "@/lib/review/queue";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewQueuePage() {
  await requirePageRole("director");
  const items = await listReviewQueue(getDb(), new Date());
  return (
    <>
      <PageHeader title="Review queue">
        <p className="text-xs text-muted">Most urgent first: urgency, then deadline, then the next observable window.</p>
      </PageHeader>
      <QueueTable items={items} />
    </>
  );
}
