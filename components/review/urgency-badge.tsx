import type { RequestUrgency } from "@/db/types";
import { cn } from "@/lib/cn";
import { URGENCY_SHORT } from "@/lib/requests/labels";

// `now` and `tonight` wear the override flare; `within_days` is calm.
export function UrgencyBadge({ urgency }: { urgency: RequestUrgency | null }) {
  if (!urgency) return <span className="text-muted">—</span>;
  return (
    <span
      className={cn(
        "inline-flex items-center rounded-full border px-2 py-0.5 text-2xs font-semibold uppercase tracking-wide",
        urgency === "now" ? "border-flare bg-flare text-black" : urgency === "tonight" ? "border-flare bg-flare-soft text-flare-ink" : "border-line text-muted",
      )}
    >
      {URGENCY_SHORT[urgency]}
    </span>
  );
}
