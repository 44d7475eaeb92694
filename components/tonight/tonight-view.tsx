"use client";

import Link from "next/link";
import { useEffect, useState } from "react";
import type { TonightQueue } from "@/lib/tonight/types";
import { AcknowledgementLog, ChangesPanel, type AcknowledgeAction } from "./changes-panel";
import type { LogExecutionAction } from "./execution-log-form";
import { LiveIndicator } from "./live-indicator";
import { NightEvents } from "./night-events";
import { NightTimeline } from "./night-timeline";
import { NightVisionToggle } from "./night-vision";
import { QueueTable } from "./queue-table";
import { SafetyCaution } from "./safety-caution";
import { clockLocal, clockUt, shiftDate } from "./time-format";
import { queueUrl, useTonightQueue } from "./use-tonight-queue";

const controlClass = "tn-button inline-flex items-center rounded-md border border-line bg-raised px-3 py-2 font-medium text-text hover:bg-sunken";

/**
 * Tonight's queue for one telescope, live: polled every few seconds, with the changes the
 * night assistant has not acknowledged yet at the top, in the flare.
 */
export function TonightView({
  initial,
  night,
  acknowledge,
  logExecution,
}: {
  initial: TonightQueue;
  /** The night asked for in the URL; null follows "tonight" as the clock moves on. */
  night: string | null;
  acknowledge: AcknowledgeAction;
  logExecution: LogExecutionAction;
}) {
  const code = initial.telescope.code;
  const { queue, error, refresh, online, lastOk } = useTonightQueue(queueUrl(code, night), initial);
  const { telescope } = queue;
  const nightOf = queue.night.nightOf;
  const readOnly = !queue.permissions.canAcknowledge;
  // Lets a browser test (or a person's script) know the controls are live.
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);

  return (
    <div className="tonight grid grid-cols-1 gap-5" data-testid="tonight-sheet" data-hydrated={hydrated ? "true" : "false"}>
      <header className="flex flex-wrap items-start justify-between gap-4 border-b border-line pb-4">
        <div>
          <h1 className="break-words text-3xl font-semibold tracking-tight">
            Tonight on {telescope.code} <span className="font-normal text-muted">· {telescope.name}</span>
          </h1>
          <p className="mt-1 text-lg">
            Night of <span className="num font-semibold">{nightOf}</span> at {telescope.siteName}{" "}
            <span className="text-muted">({telescope.timeZone})</span>
            {readOnly && <span className="text-muted"> · read only</span>}
          </p>
          <nav aria-label="Other nights" className="tn-no-print mt-2 flex flex-wrap gap-2">
            <Link className={controlClass} href={`/tonight/${code}?night=${shiftDate(nightOf, -1)}`}>
              Previous night
            </Link>
            {night !== null && (
              <Link className={controlClass} href={`/tonight/${code}`}>
                Tonight
              </Link>
            )}
            <Link className={controlClass} href={`/tonight/${code}?night=${shiftDate(nightOf, 1)}`}>
              Next night
            </Link>
          </nav>
        </div>
        <div className="tn-no-print flex flex-col items-end gap-3">
          <LiveIndicator online={online} error={error} lastOk={lastOk} startedAt={initial.now} timeZone={telescope.timeZone} />
          <div className="flex flex-wrap gap-2">
            <NightVisionToggle />
            <button type="button" className={controlClass} onClick={() => window.print()}>
              Print night sheet
            </button>
          </div>
        </div>
      </header>

      <SafetyCaution />

      <ChangesPanel queue={queue} acknowledge={acknowledge} onAcknowledged={() => refresh()} />

      <section aria-labelledby="tn-night-heading" className="grid grid-cols-1 gap-3">
        <h2 id="tn-night-heading" className="text-xl font-semibold">
          The night
        </h2>
        <NightEvents night={queue.night} timeZone={telescope.timeZone} />
        <NightTimeline queue={queue} />
      </section>

      <section aria-labelledby="tn-queue-heading" className="grid grid-cols-1 gap-3">
        <h2 id="tn-queue-heading" className="text-xl font-semibold">
          Queue <span className="text-base font-normal text-muted">in time order; times in UT and site time</span>
        </h2>
        <QueueTable queue={queue} logExecution={logExecution} onLogged={() => refresh()} />
      </section>

      <AcknowledgementLog queue={queue} />
      <p className="tn-print-only text-sm">
        Queue as of {clockUt(queue.now)} UT ({clockLocal(queue.now, telescope.timeZone)}), printed from Nightbreak: it may have changed since. Telescope limits: airmass{" "}
        {telescope.maxAirmass}, altitude {telescope.minAltitudeDeg}°.
      </p>
    </div>
  );
}
