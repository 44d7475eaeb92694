import { ATTACHMENT_KIND_LABELS, STATE_LABELS } from "@/lib/requests/labels";
import { formatDec, formatRa } from "@/lib/sky";
import type { QueueToo } from "@/lib/tonight/types";

function coordinates(too: QueueToo): string {
  const { target } = too;
  if (target.raDeg === null || target.decDeg === null) return target.kind === "ephemeris" ? "outside the ephemeris now" : "no coordinates";
  return `${formatRa(target.raDeg, { decimals: 1 })} ${formatDec(target.decDeg, { decimals: 0 })}`;
}

/** The target at a glance, for the queue row. */
export function TooTarget({ too }: { too: QueueToo }) {
  return (
    <div>
      <p className="font-semibold tn-flare-text">{too.targetName}</p>
      <p className="num text-sm">
        {coordinates(too)}
        {too.target.kind === "ephemeris" && <span className="text-muted"> · ephemeris, {too.target.ephemerisRows} rows (position now)</span>}
      </p>
    </div>
  );
}

/**
 * Why this override is on the telescope tonight: the summary in view, the whole
 * justification and the files (finding chart first) one click away.
 */
export function TooDetails({ too, blockId }: { too: QueueToo; blockId: string }) {
  const charts = too.attachments.filter((a) => a.kind === "finding_chart");
  return (
    <div className="grid gap-2">
      <p>
        <span className="text-sm font-semibold uppercase tracking-wide text-muted">Justification </span>
        {too.justificationSummary || <span className="text-muted">none given</span>}
      </p>
      <div className="flex flex-wrap items-start gap-x-6 gap-y-2">
        {charts.map((a) => (
          <a key={a.id} href={a.url} target="_blank" rel="noopener noreferrer" className="font-semibold underline underline-offset-2">
            Finding chart: {a.fileName}
          </a>
        ))}
        <details className="min-w-0 flex-1">
          <summary className="cursor-pointer font-semibold underline underline-offset-2" aria-controls={`too-${blockId}-full`}>
            Full justification and files
          </summary>
          <div id={`too-${blockId}-full`} className="mt-2 grid gap-2 rounded-md border border-line bg-raised p-3">
            <p className="whitespace-pre-line">{too.justification || "No justification was given."}</p>
            {too.attachments.length === 0 ? (
              <p className="text-muted">No files attached.</p>
            ) : (
              <ul aria-label={`Files for ${too.targetName}`} className="grid gap-1">
                {too.attachments.map((a) => (
                  <li key={a.id}>
                    <a href={a.url} target="_blank" rel="noopener noreferrer" className="underline underline-offset-2">
                      {a.fileName}
                    </a>{" "}
                    <span className="text-sm text-muted">({ATTACHMENT_KIND_LABELS[a.kind]})</span>
                  </li>
                ))}
              </ul>
            )}
            <p className="text-sm text-muted">Request: {STATE_LABELS[too.requestState]}</p>
          </div>
        </details>
      </div>
    </div>
  );
}
