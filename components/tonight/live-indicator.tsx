"use client";

import { cn } from "@/lib/cn";
import { clockLocal, clockUt } from "./time-format";
import { livenessOf, useNow } from "./use-tonight-queue";

/** "Live", "Offline · stale since 23:41 UT" or "Stale since 23:41 UT": how far to trust the screen. */
export function LiveIndicator({ online, error, lastOk, startedAt, timeZone }: { online: boolean; error: Error | undefined; lastOk: number; startedAt: string; timeZone: string }) {
  const now = useNow(startedAt, 1_000);
  const liveness = livenessOf(online, error !== undefined, lastOk, now);
  const since = new Date(lastOk).toISOString();
  const sinceText = `${clockUt(since)} UT (${clockLocal(since, timeZone)})`;
  return (
    <div data-testid="live-indicator" data-state={liveness} className="tn-no-print flex flex-col items-end leading-tight">
      <p role="status" aria-live="polite" className={cn("flex items-center gap-2 font-semibold", liveness !== "live" && "tn-flare-text")}>
        <span aria-hidden="true" className={cn("inline-block h-2.5 w-2.5 rounded-full", liveness === "live" ? "bg-ok" : "border-2 border-current")} />
        {liveness === "live" ? "Live" : liveness === "offline" ? `Offline · stale since ${sinceText}` : `Stale since ${sinceText}`}
      </p>
      {liveness !== "live" && error && <p className="text-sm text-muted">{error.message}</p>}
    </div>
  );
}
