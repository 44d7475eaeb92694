import { TimeRange } from "@/components/time/time-range";
import { Instant } from "@/components/time/instant";
import { formatDuration } from "@/lib/time/format";
import { DARKNESS_LABELS, URGENCY_LABELS } from "@/lib/requests/labels";
import type { TooRequest } from "@/lib/requests/types";
import { formatDec, formatRa } from "@/lib/sky";

/** One field in its own cell; `wide` gives a whole row to a value that cannot wrap (a time range). */
function Item({ term, wide = false, children }: { term: string; wide?: boolean; children: React.ReactNode }) {
  return (
    <div className={wide ? "col-span-full flex min-w-0 flex-col gap-0.5" : "flex min-w-0 flex-col gap-0.5"}>
      <dt className="text-2xs font-semibold uppercase tracking-wide text-muted">{term}</dt>
      <dd className="text-sm break-words">{children}</dd>
    </div>
  );
}

/** Only the limits the PI set, in words: "airmass ≤ 2 · Nautical (Sun below −12°) · Moon ≥ 30° away". */
function constraintsText(c: TooRequest["constraints"]): string {
  const parts = [
    c.maxAirmass === null ? "no airmass limit" : `airmass ≤ ${c.maxAirmass}`,
    DARKNESS_LABELS[c.darkness],
    c.minMoonSeparationDeg === null ? null : `Moon ≥ ${c.minMoonSeparationDeg}° away`,
    c.maxMoonIllumination === null ? null : `Moon ≤ ${Math.round(c.maxMoonIllumination * 100)}% lit`,
  ];
  if (c.minMoonSeparationDeg === null && c.maxMoonIllumination === null) parts.push("no Moon limits");
  return parts.filter((p) => p !== null).join(" · ");
}

/** A filed request, read-only. */
export function RequestSummary({ request, timeZone }: { request: TooRequest; timeZone: string }) {
  const t = request.target;
  const rows = t.ephemeris ?? [];
  return (
    // As many columns of at least 15rem as the panel holds (it is narrower beside the feasibility).
    <dl className="grid grid-cols-[repeat(auto-fill,minmax(min(100%,15rem),1fr))] gap-4">
      <Item term="Program">{request.programCode ? `${request.programCode} — ${request.programTitle}` : "—"}</Item>
      <Item term="PI">{request.piName}</Item>
      <Item term="Target">
        {t.kind === "fixed" && t.raDeg !== null && t.decDeg !== null ? (
          <span className="num">
            {formatRa(t.raDeg)} {formatDec(t.decDeg)} <span className="text-muted">(J2000)</span>
          </span>
        ) : (
          <span className="num">
            Ephemeris, {rows.length} rows{rows[0] && rows.at(-1) ? ` (${rows[0].time.slice(0, 16)} → ${rows.at(-1)!.time.slice(0, 16)} UT)` : ""}
            {t.hMag !== null ? `, H = ${t.hMag}${t.gSlope !== null ? `, G = ${t.gSlope}` : ""}` : ""}
          </span>
        )}
      </Item>
      <Item term="Acceptable telescopes">{request.telescopes.map((s) => `${s.code} — ${s.name}`).join(", ") || "—"}</Item>
      <Item term="Instrument">{request.instrumentCode ?? "—"}</Item>
      <Item term="Time needed">{request.durationMinutes === null ? "—" : formatDuration(request.durationMinutes)}</Item>
      <Item term="Window" wide>
        {request.earliestStart && request.latestEnd ? <TimeRange start={request.earliestStart} end={request.latestEnd} timeZone={timeZone} /> : "—"}
      </Item>
      <Item term="Deadline">{request.deadline ? <Instant at={request.deadline} timeZone={timeZone} stacked /> : "—"}</Item>
      <Item term="Urgency">{request.urgency ? URGENCY_LABELS[request.urgency] : "—"}</Item>
      <Item term="Constraints">
        <span className="num">{constraintsText(request.constraints)}</span>
      </Item>
      <Item term="Filed">{request.submittedAt ? <Instant at={request.submittedAt} timeZone={timeZone} stacked /> : "not yet"}</Item>
      <Item term="Through">{request.source === "api" ? "the API" : "the form"}</Item>
      <div className="col-span-full flex min-w-0 flex-col gap-0.5">
        <dt className="text-2xs font-semibold uppercase tracking-wide text-muted">Scientific justification</dt>
        <dd className="whitespace-pre-wrap break-words text-sm">{request.justification || "—"}</dd>
      </div>
      {request.directorNote && (
        <div className="col-span-full flex min-w-0 flex-col gap-0.5">
          <dt className="text-2xs font-semibold uppercase tracking-wide text-muted">Director&apos;s note</dt>
          <dd className="whitespace-pre-wrap break-words text-sm">{request.directorNote}</dd>
        </div>
      )}
    </dl>
  );
}
