"use client";

import { KIND_LABELS } from "@/components/schedule/kind-colors";
import { cn } from "@/lib/cn";
import { BLOCK_STATE_LABELS, LIMIT_LABELS, OUTCOME_LABELS } from "@/lib/tonight/labels";
import type { QueueBlock, TonightQueue } from "@/lib/tonight/types";
import { ExecutionLogForm, type LogExecutionAction } from "./execution-log-form";
import { clockLocal, clockUt, localDay, localRange } from "./time-format";
import { TimePair } from "./time-pair";
import { TooDetails, TooTarget } from "./too-details";

function OnSkyLine({ block, queue }: { block: QueueBlock; queue: TonightQueue }) {
  const f = block.onSky;
  if (!f) return null;
  const tz = queue.telescope.timeZone;
  const airmass = f.airmass === null ? "below the horizon" : `airmass ${f.airmass.toFixed(2)}`;
  const limit = f.limit === "airmass" ? `${LIMIT_LABELS.airmass} (${queue.telescope.maxAirmass})` : f.limit === "altitude" ? `${LIMIT_LABELS.altitude} (${queue.telescope.minAltitudeDeg}°)` : LIMIT_LABELS[f.limit];
  return (
    <p data-testid="on-sky" className="num text-lg">
      <strong>On sky now:</strong> altitude {f.altitudeDeg.toFixed(1)}°, {airmass}
      {f.beyondLimitNow ? (
        <strong className="tn-flare-text"> · past the {limit} now</strong>
      ) : (
        <>
          {" "}
          · <strong>{f.minutesLeft} min</strong> until the {limit}, at <TimePair at={f.until} timeZone={tz} />
        </>
      )}
    </p>
  );
}

function ExecutionLine({ block, timeZone }: { block: QueueBlock; timeZone: string }) {
  const e = block.execution;
  if (!e) return block.state === "done" ? <p className="text-sm text-muted">Outcome not logged yet.</p> : null;
  return (
    <p className="text-sm">
      <strong>{OUTCOME_LABELS[e.outcome]}</strong>
      {e.minutesUsed !== null && <span className="num"> · {e.minutesUsed} min</span>}
      <span className="text-muted">
        {" "}
        · logged by {e.loggedByName} at {clockUt(e.loggedAt)} UT ({clockLocal(e.loggedAt, timeZone)})
      </span>
      {e.note && <span> — {e.note}</span>}
    </p>
  );
}

function BlockRows({ block, queue, logExecution, onLogged }: { block: QueueBlock; queue: TonightQueue; logExecution: LogExecutionAction; onLogged: () => Promise<unknown> }) {
  const tz = queue.telescope.timeZone;
  const b = block;
  const utNextDay = b.startsAt.slice(0, 10) !== b.endsAt.slice(0, 10);
  const localNextDay = localDay(b.startsAt, tz) !== localDay(b.endsAt, tz);
  const label = `${b.programCode}, ${clockUt(b.startsAt)}–${clockUt(b.endsAt)} UT`;
  const minutes = Math.round((Date.parse(b.endsAt) - Date.parse(b.startsAt)) / 60_000);
  const showDetail = b.too !== null || b.onSky !== null || b.execution !== null || b.state === "done" || queue.permissions.canLog;
  return (
    <tbody className="tn-block-group" data-block-id={b.id} data-kind={b.kind} data-state={b.state} data-changed={b.changed ? "true" : "false"}>
      <tr className={cn("border-t-2 border-line align-top", b.too && "tn-too-row", b.changed && "tn-changed")}>
        <td className="num whitespace-nowrap py-2 pl-3 pr-3 text-lg">
          <time dateTime={b.startsAt}>{clockUt(b.startsAt)}</time>–<time dateTime={b.endsAt}>{clockUt(b.endsAt)}</time>
          {utNextDay && <sup>+1</sup>}
        </td>
        <td className="num whitespace-nowrap py-2 pr-3 text-lg text-muted">
          {localRange(b.startsAt, b.endsAt, tz)}
          {localNextDay && <sup>+1</sup>}
        </td>
        <td className="py-2 pr-3">
          <p className="font-semibold">{b.programCode}</p>
          <p className="text-sm text-muted">{b.programTitle}</p>
          <p className="text-sm">{b.observerName ? `Observer: ${b.observerName}` : "No observer named"}</p>
        </td>
        <td className="py-2 pr-3">
          <span className={cn(`tn-kind-${b.kind}`, "inline-block rounded px-2 py-0.5 text-sm font-semibold uppercase tracking-wide")}>{KIND_LABELS[b.kind]}</span>
          <p className="mt-1 text-sm">{b.instrumentCode ? `${b.instrumentCode} · ${b.instrumentName ?? ""}` : "No instrument set"}</p>
        </td>
        <td className="py-2 pr-3">{b.too ? <TooTarget too={b.too} /> : <span className="text-muted">In the program&apos;s own plan</span>}</td>
        <td className="py-2 pr-3">
          <p className={cn("font-semibold", b.state === "on_sky" && "text-lg")}>{BLOCK_STATE_LABELS[b.state]}</p>
          {b.changed && <p className="tn-flare-text text-sm font-semibold uppercase tracking-wide">Changed</p>}
        </td>
      </tr>
      {showDetail && (
        <tr className={cn(b.too && "tn-too-detail", b.changed && "tn-changed")}>
          <td colSpan={6} className="px-3 pb-3">
            <div className="grid gap-2">
              <OnSkyLine block={b} queue={queue} />
              {b.too && <TooDetails too={b.too} blockId={b.id} />}
              <ExecutionLine block={b} timeZone={tz} />
              {queue.permissions.canLog && (
                <details className="tn-no-print">
                  <summary className="cursor-pointer font-semibold underline underline-offset-2">Log outcome for {label}</summary>
                  <div className="mt-2 rounded-md border border-line bg-raised p-3">
                    <ExecutionLogForm blockId={b.id} label={label} scheduledMinutes={minutes} save={logExecution} onSaved={onLogged} />
                  </div>
                </details>
              )}
            </div>
          </td>
        </tr>
      )}
    </tbody>
  );
}

/** The night's blocks in time order (by UT: right across a change of the site's clocks). */
export function QueueTable({ queue, logExecution, onLogged }: { queue: TonightQueue; logExecution: LogExecutionAction; onLogged: () => Promise<unknown> }) {
  if (queue.blocks.length === 0) {
    return <p className="rounded-md border border-dashed border-line px-4 py-6 text-center text-muted">No blocks are scheduled on {queue.telescope.code} this night.</p>;
  }
  return (
    <div className="scroll-cue overflow-x-auto rounded-lg border border-line bg-raised">
      <table className="tn-queue w-full text-left" aria-label={`Queue on ${queue.telescope.code}, night of ${queue.night.nightOf}`}>
        <thead className="text-sm uppercase tracking-wide text-muted">
          <tr>
            <th scope="col" className="py-2 pl-3 pr-3 font-medium">
              UT
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              Local
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              Program and observer
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              Kind and instrument
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              Target
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              State
            </th>
          </tr>
        </thead>
        {queue.blocks.map((b) => (
          <BlockRows key={b.id} block={b} queue={queue} logExecution={logExecution} onLogged={onLogged} />
        ))}
      </table>
    </div>
  );
}
