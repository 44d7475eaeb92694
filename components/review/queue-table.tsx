import { EmptyState } from "@/components/ui/empty-state";
import type { QueueItem } from "@/lib/review/order";
import { RequestSummaryTable } from "./request-summary-table";

/** The director's queue, most urgent first (the order comes from lib/review/order.ts). */
export function QueueTable({ items }: { items: QueueItem[] }) {
  if (items.length === 0) return <EmptyState>No override requests are waiting for review.</EmptyState>;
  return <RequestSummaryTable rows={items} caption="Requests waiting for a decision, most urgent first" feasibility />;
}
