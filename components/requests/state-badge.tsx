import type { RequestState } from "@/db/types";
import { cn } from "@/lib/cn";
import { STATE_LABELS } from "@/lib/requests/labels";

// Live requests wear the override flare; finished ones are quiet.
const LIVE: readonly RequestState[] = ["submitted", "in_review", "approved"];

export function StateBadge({ state }: { state: RequestState }) {
  return (
    <span
      className={cn(
        "inline-flex items-center rounded-full border px-2 py-0.5 text-2xs font-semibold uppercase tracking-wide",
        LIVE.includes(state) ? "border-flare bg-flare-soft text-flare-ink" : state === "draft" ? "border-line bg-sunken text-muted" : "border-line text-muted",
      )}
    >
      {STATE_LABELS[state]}
    </span>
  );
}
