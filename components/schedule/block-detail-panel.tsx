"use client";

import useSWR from "swr";
import { TimeRange } from "@/components/time/time-range";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import type { BlockDetail } from "@/lib/schedule/calendar-queries";
import { formatUt } from "@/lib/time/format";
import { KindBadge } from "./kind-badge";
import { fetchJson } from "./use-schedule";
import { useState } from "react";

const ACTIONS: Record<string, string> = {
  "block.create": "created",
  "block.update": "moved or changed",
  "block.import": "imported",
  "block.override_create": "placed as an override",
  "block.override_trim": "shortened for an override",
  "block.override_split": "split for an override (this is the part before it)",
  "block.override_remainder": "split off by an override (the part after it)",
};

/** "shortened for an override" → "shortened for the override of GRB 261202A". */
function actionText(action: string, details: unknown): string {
  const text = ACTIONS[action] ?? action;
  const target = (details as { targetName?: unknown } | null)?.targetName;
  return typeof target === "string" && action.startsWith("block.override_") ? text.replace("an override", `the override of ${target}`) : text;
}

export function BlockDetailPanel({ id, canEdit, onClose, onDeleted }: { id: string; canEdit: boolean; onClose: () => void; onDeleted: () => void }) {
  const { data, error, isLoading } = useSWR(`/api/v1/blocks/${id}`, (url: string) => fetchJson<{ block: BlockDetail }>(url));
  const [failure, setFailure] = useState<string | null>(null);
  const block = data?.block;

  async function remove() {
    if (!block || !window.confirm(`Remove ${block.programCode}'s block? This cannot be undone.`)) return;
    try {
      await fetchJson(`/api/v1/blocks/${id}`, { method: "DELETE" });
      onDeleted();
    } catch (e) {
      setFailure(e instanceof Error ? e.message : "The block could not be removed.");
    }
  }

  return (
    <section aria-label="Block details" className="rounded-lg border border-line bg-raised p-4">
      <div className="mb-2 flex items-start justify-between gap-2">
        <h2 className="font-semibold">{block ? `${block.programCode} — ${block.programTitle}` : "Block"}</h2>
        <button type="button" onClick={onClose} className="text-xs text-muted hover:text-text" aria-label="Close block details">
          ✕
        </button>
      </div>
      {isLoading && <p className="text-muted">Loading…</p>}
      {error && <Alert tone="error">{error.message}</Alert>}
      {block && (
        <>
          <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1.5 [&>dd]:break-words">
            <dt className="text-muted">Kind</dt>
            <dd><KindBadge kind={block.kind} /></dd>
            <dt className="text-muted">When</dt>
            {/* Fits on one line in the panel; should a long zone name not, it wraps rather than overflow. */}
            <dd className="[&_.num]:whitespace-normal">
              <TimeRange start={new Date(block.startsAt)} end={new Date(block.endsAt)} timeZone={block.timeZone} />
            </dd>
            <dt className="text-muted">Telescope</dt>
            <dd>{block.telescopeName}, {block.siteName}</dd>
            <dt className="text-muted">PI</dt>
            <dd>{block.piName}</dd>
            <dt className="text-muted">Observer</dt>
            <dd>{block.observerName ?? "—"}</dd>
            <dt className="text-muted">Instrument</dt>
            <dd>{block.instrumentName ?? "—"}</dd>
            {block.notes && (
              <>
                <dt className="text-muted">Notes</dt>
                <dd>{block.notes}</dd>
              </>
            )}
          </dl>
          <h3 className="mt-4 text-2xs font-semibold uppercase tracking-wide text-muted">History</h3>
          {block.history.length ? (
            <ol className="mt-1 space-y-1 text-xs">
              {block.history.map((h, i) => (
                <li key={i}>
                  <span className="num">{formatUt(new Date(h.at))} UT</span> — {actionText(h.action, h.details)} by {h.actorName ?? "the system"}
                </li>
              ))}
            </ol>
          ) : (
            <p className="mt-1 text-xs text-muted">Part of the semester as first loaded; no changes since.</p>
          )}
          {canEdit && (
            <div className="mt-4 flex flex-col gap-2">
              <Button variant="danger" onClick={remove}>Remove block</Button>
              {failure && <Alert tone="error">{failure}</Alert>}
            </div>
          )}
        </>
      )}
    </section>
  );
}
