"use client";

import { useState, useTransition } from "react";
import type { ActionResult } from "@/lib/actions/result";
import { cn } from "@/lib/cn";
import { CHANGE_KIND_LABELS } from "@/lib/tonight/labels";
import type { TonightQueue } from "@/lib/tonight/types";
import { clockUt, localDay, localRange, utRange } from "./time-format";
import { TimePair } from "./time-pair";

export type AcknowledgeAction = (input: unknown) => Promise<ActionResult>;

/**
 * What changed since the person last acknowledged, in the flare until they say they have
 * seen it. Acknowledging names the newest change on screen, so nothing that arrives in
 * the meantime is acknowledged unseen.
 */
export function ChangesPanel({ queue, acknowledge, onAcknowledged }: { queue: TonightQueue; acknowledge: AcknowledgeAction; onAcknowledged: () => Promise<unknown> }) {
  const { changes, acknowledgements, permissions, telescope } = queue;
  const [result, setResult] = useState<ActionResult | null>(null);
  const [pending, startTransition] = useTransition();
  const tz = telescope.timeZone;
  const mine = changes.basis === "mine";
  const title = mine ? "Changes since your last acknowledgement" : "Changes not yet acknowledged by a night assistant";
  const pendingCount = changes.items.length + changes.more;

  function onAcknowledge() {
    const through = changes.throughChangeId;
    if (through === null) return;
    startTransition(async () => {
      let answer: ActionResult;
      try {
        answer = await acknowledge({ telescope: telescope.code, throughChangeId: through });
      } catch {
        answer = { ok: false, message: "The acknowledgement did not reach the server. Check the connection and try again." };
      }
      setResult(answer);
      if (answer.ok) await onAcknowledged();
    });
  }

  return (
    <section aria-labelledby="tn-changes-heading" data-testid="changes-panel" data-pending={pendingCount} className={cn("rounded-lg border p-4", pendingCount ? "tn-changed border-transparent" : "border-line bg-raised")}>
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="tn-changes-heading" className="text-xl font-semibold">
          {title}
          {pendingCount > 0 && <span className="tn-flare-text"> · {pendingCount}</span>}
        </h2>
        {permissions.canAcknowledge && pendingCount > 0 && (
          <button
            type="button"
            onClick={onAcknowledge}
            disabled={pending}
            className="tn-no-print rounded-md bg-text px-4 py-2 text-base font-semibold text-surface hover:opacity-90 disabled:opacity-50"
          >
            Acknowledge changes
          </button>
        )}
      </div>
      {pendingCount === 0 ? (
        <p className="mt-2 text-muted">
          {mine ? "Nothing new since your last acknowledgement." : "Every change has been acknowledged."}
          {mine && acknowledgements.mine && (
            <>
              {" "}
              Last acknowledged at <TimePair at={acknowledgements.mine.at} timeZone={tz} />.
            </>
          )}
        </p>
      ) : (
        <ul className="mt-3 grid gap-2" aria-label="Unacknowledged changes">
          {changes.items.map((c) => (
            <li key={c.id} data-unacknowledged="true" data-change-kind={c.kind} className="rounded-md border border-line bg-raised px-3 py-2">
              <p className="font-semibold">
                <span className="tn-flare-text">{CHANGE_KIND_LABELS[c.kind]}</span>
                {c.targetName && <span> · {c.targetName}</span>}
                <span className="font-normal"> — {c.summary}</span>
              </p>
              <p className="num text-sm text-muted">
                Affects {utRange(c.startsAt, c.endsAt)} (local {localDay(c.startsAt, tz)} {localRange(c.startsAt, c.endsAt, tz)}) · recorded {clockUt(c.at)} UT · change{" "}
                {c.id}
              </p>
            </li>
          ))}
        </ul>
      )}
      {changes.more > 0 && <p className="mt-2 text-sm">{changes.more} more not listed here: acknowledge these to see them.</p>}
      <p aria-live="polite" className={cn("mt-2 text-sm", result && !result.ok ? "text-danger" : "text-ok")}>
        {result && (!result.ok || pendingCount === 0) ? result.message : null}
      </p>
    </section>
  );
}

/** Who acknowledged what, and when: the director's view of the desk. */
export function AcknowledgementLog({ queue }: { queue: TonightQueue }) {
  const { recent } = queue.acknowledgements;
  return (
    <section aria-labelledby="tn-acks-heading" className="rounded-lg border border-line bg-raised p-4">
      <h2 id="tn-acks-heading" className="text-lg font-semibold">
        Acknowledgements on {queue.telescope.code}
      </h2>
      {recent.length === 0 ? (
        <p className="mt-1 text-muted">No one has acknowledged a change on this telescope yet.</p>
      ) : (
        <div className="scroll-cue mt-2 overflow-x-auto">
          <table className="w-full text-left">
            <caption className="sr-only">Recent acknowledgements, newest first</caption>
            <thead className="text-sm text-muted">
              <tr>
                <th scope="col" className="py-1 pr-4 font-medium">
                  Night assistant
                </th>
                <th scope="col" className="py-1 pr-4 font-medium">
                  When
                </th>
                <th scope="col" className="py-1 font-medium">
                  Through change
                </th>
              </tr>
            </thead>
            <tbody>
              {recent.map((a) => (
                <tr key={`${a.at}-${a.userName}`} className="border-t border-line">
                  <td className="py-1 pr-4">{a.userName}</td>
                  <td className="py-1 pr-4">
                    <span className="num">{localDay(a.at, queue.telescope.timeZone)}</span> <TimePair at={a.at} timeZone={queue.telescope.timeZone} />
                  </td>
                  <td className="num py-1">{a.throughChangeId}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
