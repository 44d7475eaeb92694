import { Instant } from "@/components/time/instant";
import { STATE_LABELS } from "@/lib/requests/labels";
import type { RequestEvent } from "@/lib/requests/types";

/** Who did what, when: every state change of the request. */
export function RequestHistory({ events, timeZone }: { events: RequestEvent[]; timeZone: string }) {
  return (
    <ol aria-label="State history" className="flex flex-col gap-2">
      {events.map((e) => (
        <li key={e.id} className="border-l-2 border-line pl-3 text-sm">
          <p>
            <span className="font-medium">{e.fromState ? `${STATE_LABELS[e.fromState]} → ${STATE_LABELS[e.toState]}` : STATE_LABELS[e.toState]}</span>
            <span className="text-muted"> · {e.actorName ?? "the system"}</span>
          </p>
          <p className="text-xs">
            <Instant at={e.at} timeZone={timeZone} />
          </p>
          {e.note && <p className="text-xs text-muted">“{e.note}”</p>}
        </li>
      ))}
    </ol>
  );
}
